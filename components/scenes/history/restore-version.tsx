"use client";
// "Restore this version", asked twice: the chosen version's scene becomes a new latest version.
// Nothing is deleted, so a restore can itself be undone by restoring the version before it.
import { useState } from "react";

import { Button } from "@/components/ui/button";

export type RestoreBlocker = "unsaved-edits" | "already-current" | null;

const BLOCKER_TEXT: Record<Exclude<RestoreBlocker, null>, string> = {
  "unsaved-edits": "You have unsaved edits in the editor: save or drop them before restoring.",
  "already-current": "This is the current version.",
};

export function RestoreVersion({
  version,
  currentVersion,
  blocker,
  pending,
  failure,
  onRestore,
}: {
  version: number;
  currentVersion: number;
  blocker: RestoreBlocker;
  pending: boolean;
  /** Why the last attempt failed, in words for the person. */
  failure: string | null;
  onRestore: () => void;
}) {
  const [confirming, setConfirming] = useState(false);
  const asking = confirming && blocker === null;

  return (
    <div className="flex flex-col gap-2" data-testid="restore-version">
      {asking ? (
        <div role="alertdialog" aria-label={`Restore version ${version}`} className="flex flex-wrap items-center gap-3 rounded-md border border-tide-300 bg-tide-50 px-3 py-2 text-sm">
          <span className="text-ink-soft">
            Restore version {version}? Its scene becomes version {currentVersion + 1}; nothing is removed from the history.
          </span>
          <Button
            size="sm"
            disabled={pending}
            onClick={() => {
              setConfirming(false);
              onRestore();
            }}
          >
            Restore version {version}
          </Button>
          <Button size="sm" variant="quiet" onClick={() => setConfirming(false)}>
            Cancel
          </Button>
        </div>
      ) : (
        <div className="flex flex-wrap items-center gap-3">
          <Button size="sm" variant="secondary" disabled={blocker !== null || pending} onClick={() => setConfirming(true)}>
            {pending ? "Restoring…" : "Restore this version"}
          </Button>
          {blocker ? <span className="text-[12.5px] text-muted">{BLOCKER_TEXT[blocker]}</span> : null}
        </div>
      )}
      {failure ? (
        <p role="alert" className="text-[12.5px] font-medium text-signal-error">
          {failure}
        </p>
      ) : null}
    </div>
  );
}
