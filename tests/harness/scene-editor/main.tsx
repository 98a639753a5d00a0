// Mounts the scene editor on the demo scene "Design A" as the study notebook would: the parent keeps
// the scene and would save it. `?readonly=1` opens it as a viewer; `?view=split|code` picks the view.
import "./harness.css";

import { StrictMode, useEffect, useState } from "react";
import { createRoot } from "react-dom/client";

import { SceneEditor } from "@/components/scene-editor/scene-editor";
import designA from "@/db/seed/scenes/design-a-3m-reflective.json";
import type { Scene, SceneInput } from "@/lib/fdtd/scene";

declare global {
  interface Window {
    /** For shoot.mjs: the scene as the parent last received it, and how many changes arrived. */
    harness?: { scene: () => Scene | SceneInput; changes: () => number };
  }
}

const query = new URLSearchParams(location.search);
const readOnly = query.get("readonly") === "1";
const view = query.get("view");

function Harness() {
  const [scene, setScene] = useState<Scene | SceneInput>(designA as SceneInput);
  const [changes, setChanges] = useState(0);
  useEffect(() => {
    window.harness = { scene: () => scene, changes: () => changes };
  }, [scene, changes]);
  return (
    <div className="flex h-screen flex-col gap-3 bg-paper p-4">
      <header className="flex items-baseline gap-3">
        <h1 className="text-[19px] font-semibold text-ink">{scene.name || "Untitled scene"}</h1>
        <span className="text-[13px] text-muted">
          Scene editor harness · {readOnly ? "viewer" : `${changes} unsaved change${changes === 1 ? "" : "s"}`}
        </span>
      </header>
      <div className="min-h-0 flex-1">
        <SceneEditor
          scene={scene}
          readOnly={readOnly}
          initialView={view === "split" || view === "code" ? view : "canvas"}
          onChange={(next) => {
            setScene(next);
            setChanges((n) => n + 1);
          }}
        />
      </div>
    </div>
  );
}

createRoot(document.getElementById("root")!).render(
  <StrictMode>
    <Harness />
  </StrictMode>,
);
