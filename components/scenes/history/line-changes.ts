// How many lines a comparison adds and removes, for the heading above the side-by-side view.
import { diffLines } from "diff";

/** Above this many differing lines the count is not worth the time it takes (a long sampled signal). */
const MAX_COUNTED_EDITS = 20_000;

/** Lines added and removed from `original` to `modified`; null when they differ too much to count quickly. */
export function countChangedLines(original: string, modified: string): { added: number; removed: number } | null {
  const parts = diffLines(original, modified, { maxEditLength: MAX_COUNTED_EDITS });
  if (!parts) return null;
  let added = 0;
  let removed = 0;
  for (const part of parts) {
    if (part.added) added += part.count;
    else if (part.removed) removed += part.count;
  }
  return { added, removed };
}
