"use client";
// The saved versions of a scene, newest first: number, author, when (relative, exact on hover), the
// note they left and what changed since the version before. Choosing one shows its comparison.
import { formatWhen } from "@/lib/client/format";
import type { SceneVersionItem } from "@/lib/http/api-types";

const exactTime = new Intl.DateTimeFormat("en-GB", { dateStyle: "long", timeStyle: "medium" });

export interface VersionRow {
  item: SceneVersionItem;
  /** What changed since the version before: a sentence, or null while the two versions load. */
  summary: string | null;
}

export function VersionList({
  rows,
  currentVersion,
  selected,
  onSelect,
  olderCount,
  onShowOlder,
}: {
  rows: readonly VersionRow[];
  currentVersion: number;
  selected: number;
  onSelect: (version: number) => void;
  /** Versions older than the ones listed. */
  olderCount: number;
  onShowOlder: () => void;
}) {
  return (
    <div className="flex flex-col gap-2">
      <ol aria-label="Saved versions" className="flex flex-col gap-1.5" data-testid="version-list">
        {rows.map(({ item, summary }) => {
          const isSelected = item.version === selected;
          return (
            <li key={item.version}>
              <button
                type="button"
                onClick={() => onSelect(item.version)}
                aria-current={isSelected ? "true" : undefined}
                data-testid={`version-${item.version}`}
                className={`w-full rounded-md border px-3 py-2 text-left transition ${isSelected ? "border-tide-500 bg-tide-50/60 shadow-sm" : "border-rule bg-panel hover:border-rule-strong hover:bg-paper"}`}
              >
                <span className="flex flex-wrap items-baseline gap-x-2 text-sm">
                  <span className="font-mono text-[12.5px] font-semibold text-ink">v{item.version}</span>
                  {item.version === currentVersion ? <span className="rounded bg-tide-600 px-1.5 text-[11px] font-medium text-white">current</span> : null}
                  <span className="font-medium text-ink-soft">{item.authorName ?? "Someone"}</span>
                  <time dateTime={item.createdAt} title={exactTime.format(new Date(item.createdAt))} className="ml-auto text-xs text-muted">
                    {formatWhen(item.createdAt)}
                  </time>
                </span>
                {item.note ? <span className="mt-0.5 block text-[13px] text-ink">“{item.note}”</span> : null}
                <span className={`mt-0.5 block text-[12.5px] leading-snug ${summary ? "text-muted" : "animate-pulse text-muted/70"}`}>{summary ?? "Comparing with the version before…"}</span>
              </button>
            </li>
          );
        })}
      </ol>
      {olderCount > 0 ? (
        <button type="button" onClick={onShowOlder} className="self-start rounded px-2 py-1 text-sm font-medium text-tide-700 hover:bg-tide-50">
          Show older versions ({olderCount})
        </button>
      ) : null}
    </div>
  );
}
