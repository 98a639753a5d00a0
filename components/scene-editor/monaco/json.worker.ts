import "monaco-editor/language/json/json.worker.js";
