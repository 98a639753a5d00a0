"use client";
// One version compared with the version before it, or with the current one: the changes in words,
// the two scene texts side by side, and the way back to it.
import { useMemo, type ReactNode } from "react";

import { formatSceneJson } from "@/components/scene-editor/model/scene-text";

import { JsonDiffView } from "./json-diff-view";
import { countChangedLines } from "./line-changes";
import { describeSceneChanges } from "./scene-changes";

export type CompareWith = "previous" | "current";

export interface ComparedVersion {
  version: number;
  /** Stored scene JSON; undefined while it loads. */
  data: unknown;
}

export function VersionComparison({
  selected,
  previous,
  current,
  compareWith,
  onCompareWith,
  restore,
}: {
  selected: ComparedVersion;
  /** The version before the selected one; null for the first version. */
  previous: ComparedVersion | null;
  current: ComparedVersion;
  compareWith: CompareWith;
  onCompareWith: (next: CompareWith) => void;
  /** The restore control, when the caller's role may restore. */
  restore: ReactNode;
}) {
  const isCurrent = selected.version === current.version;
  // Older on the left, newer on the right: what changed going forward in time.
  const [older, newer] = compareWith === "current" ? [selected, current] : [previous, selected];
  const olderData = older?.data;
  const newerData = newer.data;
  const ready = older !== null && olderData !== undefined && newerData !== undefined;

  const texts = useMemo(() => (ready ? { original: formatSceneJson(olderData), modified: formatSceneJson(newerData) } : null), [ready, olderData, newerData]);
  const changes = useMemo(() => (ready ? describeSceneChanges(olderData, newerData) : null), [ready, olderData, newerData]);
  const lines = useMemo(() => (texts ? countChangedLines(texts.original, texts.modified) : null), [texts]);

  const choices: { value: CompareWith; label: string; disabled: boolean }[] = [
    { value: "previous", label: previous ? `With version ${previous.version}` : "With the version before", disabled: previous === null },
    { value: "current", label: `With the current version (${current.version})`, disabled: isCurrent },
  ];

  return (
    <section aria-label={`Version ${selected.version}`} className="flex min-w-0 flex-col gap-3 rounded-lg border border-rule bg-panel p-4">
      <div className="flex flex-wrap items-center gap-3">
        <h3 className="text-base font-semibold text-ink">Version {selected.version}</h3>
        <div role="radiogroup" aria-label="Compare" className="flex rounded-md border border-rule-strong p-0.5 text-[13px]">
          {choices.map((choice) => (
            <button
              key={choice.value}
              type="button"
              role="radio"
              aria-checked={compareWith === choice.value}
              disabled={choice.disabled}
              onClick={() => onCompareWith(choice.value)}
              className={`rounded px-2.5 py-1 font-medium transition disabled:cursor-not-allowed disabled:text-muted/60 ${compareWith === choice.value ? "bg-tide-600 text-white" : "text-ink-soft hover:bg-paper"}`}
            >
              {choice.label}
            </button>
          ))}
        </div>
      </div>

      {older === null ? (
        <p className="text-sm text-muted">Version {selected.version} is where this scene started: there is nothing before it to compare with.</p>
      ) : !ready ? (
        <p role="status" className="animate-pulse text-sm text-muted">
          Loading versions {older.version} and {newer.version}…
        </p>
      ) : (
        <>
          <div className="text-sm">
            <p className="font-medium text-ink-soft">
              From version {older.version} to {newer.version === current.version && compareWith === "current" ? `the current version (${newer.version})` : `version ${newer.version}`}
              {lines ? (
                <span className="ml-2 font-mono text-[12px] font-normal">
                  <span className="text-signal-ok">+{lines.added}</span> <span className="text-signal-error">−{lines.removed}</span> lines
                </span>
              ) : null}
            </p>
            {changes && changes.length > 0 ? (
              <ul className="mt-1 list-disc pl-5 text-ink-soft" data-testid="version-changes">
                {changes.map((change, index) => (
                  <li key={`${index}-${change}`}>{change.charAt(0).toUpperCase() + change.slice(1)}</li>
                ))}
              </ul>
            ) : (
              <p className="mt-1 text-muted">The scenes are the same.</p>
            )}
          </div>
          {/* A new pair gets a new diff view: Monaco folds unchanged stretches only for the texts it opened with. */}
          {texts ? <JsonDiffView key={`${older.version}:${newer.version}`} original={texts.original} modified={texts.modified} className="h-[520px]" /> : null}
        </>
      )}
      {restore}
    </section>
  );
}
