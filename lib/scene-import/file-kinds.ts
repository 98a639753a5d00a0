// Which import reads a file, told by its name, and how large a file of each kind may be. The size is
// checked on the file itself, before it is read into memory.
import { MAX_CSV_CHARACTERS } from "./csv";
import { MAX_DXF_CHARACTERS } from "./dxf";
import type { ImportResult } from "./geometry";
import { MAX_WAV_BYTES } from "./wav";

export type ImportKind = "dxf" | "csv" | "wav";

const KIND_BY_EXTENSION: Record<string, ImportKind> = { dxf: "dxf", csv: "csv", txt: "csv", wav: "wav", wave: "wav" };

/** For a file input's `accept`. */
export const IMPORT_FILE_EXTENSIONS = Object.keys(KIND_BY_EXTENSION).map((extension) => `.${extension}`);

/** Largest file of each kind, bytes (a text's characters are at most its bytes). */
export const MAX_IMPORT_BYTES: Record<ImportKind, number> = { dxf: MAX_DXF_CHARACTERS, csv: MAX_CSV_CHARACTERS, wav: MAX_WAV_BYTES };

/** The import for a file name and size, or why it has none. */
export function importKindOf(fileName: string, sizeBytes: number): ImportResult<{ kind: ImportKind }> {
  const extension = /\.([A-Za-z0-9]+)$/.exec(fileName)?.[1]?.toLowerCase() ?? "";
  const kind = KIND_BY_EXTENSION[extension];
  if (!kind) return { ok: false, message: `“${fileName}” is not a file this import reads: choose a drawing (.dxf), a coordinate table (.csv) or a recording (.wav).` };
  const limit = MAX_IMPORT_BYTES[kind];
  if (sizeBytes > limit) {
    return { ok: false, message: `“${fileName}” is ${(sizeBytes / 1048576).toFixed(1)} MB; at most ${limit / 1048576} MB are read for a .${extension} file.` };
  }
  return { ok: true, kind };
}
