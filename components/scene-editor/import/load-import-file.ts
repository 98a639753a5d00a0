// Reading a chosen file into what its import panel needs. The file's size is checked before it is
// read into memory; a DXF and a WAV are read in full here, a table is kept as text because what it
// becomes (barrier, solid, receivers) is chosen afterwards.
import { readDxf, type DxfDrawing } from "@/lib/scene-import/dxf";
import { importKindOf } from "@/lib/scene-import/file-kinds";
import type { ImportResult } from "@/lib/scene-import/geometry";
import { importWav, type WavRecording } from "@/lib/scene-import/wav";

export type LoadedImport =
  | { kind: "dxf"; fileName: string; drawing: DxfDrawing }
  | { kind: "csv"; fileName: string; text: string }
  | { kind: "wav"; fileName: string; recording: WavRecording };

export async function loadImportFile(file: File): Promise<ImportResult<{ loaded: LoadedImport }>> {
  const kind = importKindOf(file.name, file.size);
  if (!kind.ok) return kind;
  const fileName = file.name;
  try {
    switch (kind.kind) {
      case "dxf": {
        const read = readDxf(await file.text());
        return read.ok ? { ok: true, loaded: { kind: "dxf", fileName, drawing: read.drawing } } : read;
      }
      case "csv":
        return { ok: true, loaded: { kind: "csv", fileName, text: await file.text() } };
      case "wav": {
        const read = importWav(new Uint8Array(await file.arrayBuffer()));
        return read.ok ? { ok: true, loaded: { kind: "wav", fileName, recording: read.recording } } : read;
      }
    }
  } catch (error) {
    // The browser refused to read the file (moved, deleted, no permission).
    return { ok: false, message: `“${fileName}” could not be read: ${error instanceof Error ? error.message : String(error)}` };
  }
}
