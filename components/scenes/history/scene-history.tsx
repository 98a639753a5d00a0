"use client";
// A scene's history: who saved which version when and what they changed, each version compared with
// the one before it or with the current one, and restoring an old version as a new one.
import { useCallback, useEffect, useMemo, useState } from "react";

import { ErrorState, LoadingRows } from "@/components/ui/states";
import { roleAllows, type TeamRole } from "@/lib/access/roles";
import { ApiError } from "@/lib/client/api";
import { useRestoreSceneVersion, useSceneVersions } from "@/lib/client/queries";
import type { SceneRecord } from "@/lib/http/api-types";

import { RestoreVersion, type RestoreBlocker } from "./restore-version";
import { describeSceneChanges, summariseSceneChanges } from "./scene-changes";
import { useVersionData } from "./use-version-data";
import { VersionComparison, type CompareWith } from "./version-comparison";
import { VersionList, type VersionRow } from "./version-list";

/** Versions listed at first and added by each "show older". */
const PAGE_SIZE = 12;

function restoreFailureText(error: unknown): string {
  if (error instanceof ApiError && error.status === 409) return "Someone saved a newer version in the meantime. The list now shows it: compare again before restoring.";
  return error instanceof Error ? error.message : String(error);
}

export function SceneHistory({ record, role, hasUnsavedEdits }: { record: SceneRecord; role: TeamRole; hasUnsavedEdits: boolean }) {
  const list = useSceneVersions(record.id);
  const restore = useRestoreSceneVersion(record);
  const [shownCount, setShownCount] = useState(PAGE_SIZE);
  /** The version chosen in the list; null follows the newest. */
  const [chosen, setChosen] = useState<number | null>(null);
  const [compareWith, setCompareWith] = useState<CompareWith>("previous");

  // A save elsewhere on the page makes the scene newer than the list: fetch the list again.
  const newestListed = list.data?.versions[0]?.version ?? 0;
  const { refetch } = list;
  useEffect(() => {
    if (list.isSuccess && newestListed < record.version) void refetch();
  }, [list.isSuccess, newestListed, record.version, refetch]);

  const versions = useMemo(() => list.data?.versions ?? [], [list.data]);
  const selected = versions.find((item) => item.version === chosen) ?? versions[0] ?? null;
  const selectedIndex = selected ? versions.indexOf(selected) : -1;
  const previous = versions[selectedIndex + 1] ?? null;

  // Each listed version, the one before the oldest listed (for its summary) and the pair compared.
  const needed = useMemo(() => {
    const wanted = new Set(versions.slice(0, shownCount + 1).map((item) => item.version));
    if (selected) wanted.add(selected.version);
    if (previous) wanted.add(previous.version);
    wanted.delete(record.version);
    return [...wanted].sort((a, b) => b - a);
  }, [versions, shownCount, selected, previous, record.version]);
  const fetched = useVersionData(record.id, needed);
  // The current version's JSON is the scene itself: no need to fetch it again.
  const dataOf = useCallback((version: number): unknown => (version === record.version ? record.data : fetched.byVersion.get(version)), [record.version, record.data, fetched.byVersion]);

  // Comparing scenes is not free (a long sampled signal): only when a version arrives or the list grows.
  const rows: VersionRow[] = useMemo(
    () =>
      versions.slice(0, shownCount).map((item, index) => {
        const before = versions[index + 1];
        if (!before) return { item, summary: "First version" };
        const older = dataOf(before.version);
        const newer = dataOf(item.version);
        return { item, summary: older === undefined || newer === undefined ? null : summariseSceneChanges(describeSceneChanges(older, newer)) };
      }),
    [versions, shownCount, dataOf],
  );

  if (list.isPending) return <LoadingRows label="Loading the history" />;
  if (list.isError) return <ErrorState title="The history could not be loaded" message={list.error.message} onRetry={() => void refetch()} />;
  if (!selected) return <p className="text-sm text-muted">This scene has no saved versions.</p>;

  const canRestore = roleAllows(role, "scene:edit");
  const blocker: RestoreBlocker = selected.version === record.version ? "already-current" : hasUnsavedEdits ? "unsaved-edits" : null;
  // The current version compares with the one before it (or says it is the first); the first, with the current one.
  const effectiveCompare: CompareWith = selected.version === record.version ? "previous" : !previous ? "current" : compareWith;

  function restoreSelected(version: number) {
    restore.mutate(
      { version, baseVersion: record.version },
      {
        onSuccess: ({ scene }) => {
          // Show what the restore did: the new version against the one it replaced.
          setChosen(scene.version);
          setCompareWith("previous");
        },
      },
    );
  }

  return (
    <div className="grid gap-4 lg:grid-cols-[22rem_minmax(0,1fr)]" data-testid="scene-history">
      <div className="flex flex-col gap-2">
        <h2 className="text-base font-semibold text-ink">Versions</h2>
        {fetched.failed ? <p className="text-[12.5px] text-signal-error">Some versions could not be loaded; their summaries are missing.</p> : null}
        <VersionList
          rows={rows}
          currentVersion={record.version}
          selected={selected.version}
          onSelect={(version) => {
            setChosen(version);
            restore.reset();
          }}
          olderCount={Math.max(0, versions.length - rows.length)}
          onShowOlder={() => setShownCount((count) => count + PAGE_SIZE)}
        />
      </div>
      <VersionComparison
        selected={{ version: selected.version, data: dataOf(selected.version) }}
        previous={previous ? { version: previous.version, data: dataOf(previous.version) } : null}
        current={{ version: record.version, data: record.data }}
        compareWith={effectiveCompare}
        onCompareWith={setCompareWith}
        restore={
          canRestore ? (
            <RestoreVersion
              key={selected.version}
              version={selected.version}
              currentVersion={record.version}
              blocker={blocker}
              pending={restore.isPending}
              failure={restore.isError ? restoreFailureText(restore.error) : null}
              onRestore={() => restoreSelected(selected.version)}
            />
          ) : null
        }
      />
    </div>
  );
}
