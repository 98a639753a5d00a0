// The study's run table without React: one row per saved run in the table's own words, the text
// and status filter, and the figures formatted once, so sorting compares numbers, not labels.
import type { RunListItem, RunStatusName } from "@/lib/http/api-types";
import type { ReviewStateName } from "@/lib/review/review-states";
import { signOffStanding } from "@/lib/review/sign-off-standing";

export interface RunTableRow {
  id: string;
  sceneName: string;
  sceneVersion: number;
  /** "Scene name v3": what the text filter and the variant column read. */
  variant: string;
  status: RunStatusName;
  who: string;
  createdAt: string;
  /** Milliseconds since 1970, for sorting by time. */
  createdAtMs: number;
  wallSeconds: number | null;
  cells: number | null;
  /** Cell size, m. */
  cellSize: number | null;
  warningCount: number | null;
  /** Largest receiver peak level, dB re 20 µPa; null when every receiver is silent or none was recorded. */
  loudestPeakLevelDb: number | null;
  reviewState: ReviewStateName;
  /** Signed off, but for a scene version older than the scene's current one (or a deleted scene). */
  signOffIsOlder: boolean;
  /** Who signed it off, when it is signed off. */
  signedOffBy: string | null;
  /** Sorts by how far the run is on its way to a sign-off that still holds. */
  reviewRank: number;
}

const reviewRanks: Record<ReviewStateName, number> = { unreviewed: 0, revision_asked: 1, awaiting_review: 2, signed_off: 4 };

export function toRunTableRow(item: RunListItem): RunTableRow {
  const sceneName = item.sceneName ?? "Deleted scene";
  const signOffIsOlder = item.signOff !== null && signOffStanding({ signedVersion: item.signOff.sceneVersion, sceneCurrentVersion: item.sceneCurrentVersion }).kind !== "current";
  return {
    id: item.id,
    sceneName,
    sceneVersion: item.sceneVersion,
    variant: `${sceneName} v${item.sceneVersion}`,
    status: item.status,
    who: item.createdByName ?? "Former member",
    createdAt: item.createdAt,
    createdAtMs: Date.parse(item.createdAt),
    wallSeconds: item.figures?.wallSeconds ?? null,
    cells: item.figures?.grid.cells ?? null,
    cellSize: item.figures?.grid.cellSize ?? null,
    warningCount: item.figures?.warningCount ?? null,
    loudestPeakLevelDb: item.figures?.loudestPeakLevelDb ?? null,
    reviewState: item.reviewState,
    signOffIsOlder,
    signedOffBy: item.signOff ? (item.signOff.signedOffByName ?? "a former member") : null,
    reviewRank: reviewRanks[item.reviewState] - (signOffIsOlder ? 1 : 0),
  };
}

export type RunStatusFilter = RunStatusName | "all";
export type RunReviewFilter = ReviewStateName | "all";

export interface RunTableFilter {
  /** Matched, case and accents aside, against the variant and who ran it; every word must match. */
  text: string;
  status: RunStatusFilter;
  /** Absent means every review state. */
  review?: RunReviewFilter;
}

function folded(text: string): string {
  return text.normalize("NFD").replace(/\p{Diacritic}/gu, "").toLowerCase();
}

export function matchesRunFilter(row: RunTableRow, filter: RunTableFilter): boolean {
  if (filter.status !== "all" && row.status !== filter.status) return false;
  if (filter.review !== undefined && filter.review !== "all" && row.reviewState !== filter.review) return false;
  const words = folded(filter.text).split(/\s+/).filter(Boolean);
  if (words.length === 0) return true;
  const haystack = folded(`${row.variant} ${row.who}`);
  return words.every((word) => haystack.includes(word));
}

const figure = new Intl.NumberFormat("en-GB", { maximumSignificantDigits: 3 });

export function formatWallTime(seconds: number | null): string {
  if (seconds === null) return "–";
  if (seconds < 60) return `${seconds.toFixed(seconds < 10 ? 1 : 0)} s`;
  const minutes = Math.floor(seconds / 60);
  return minutes < 60 ? `${minutes} min ${Math.round(seconds % 60)} s` : `${Math.floor(minutes / 60)} h ${minutes % 60} min`;
}

export function formatGrid(cells: number | null, cellSize: number | null): string {
  if (cells === null || cellSize === null) return "–";
  const count = cells >= 1e6 ? `${figure.format(cells / 1e6)} M` : cells >= 1e3 ? `${figure.format(cells / 1e3)} k` : String(cells);
  return `${count} cells, dx ${figure.format(cellSize * 1000)} mm`;
}

export function formatLevel(db: number | null): string {
  return db === null ? "–" : `${db.toFixed(1)} dB`;
}

export const runStatusLabels: Record<RunStatusName, string> = {
  queued: "Queued",
  running: "Running",
  completed: "Completed",
  failed: "Failed",
  cancelled: "Cancelled",
};
