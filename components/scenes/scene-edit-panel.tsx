"use client";
// Editing a scene: the drawing and code views on a draft, saved as a new version. A save based on
// an older version (409) keeps the draft and offers both ways out: load the latest, or keep the
// draft as a new variant. Nothing typed is lost.
import { useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { SceneEditor } from "@/components/scene-editor/scene-editor";
import { Button } from "@/components/ui/button";
import { ErrorState } from "@/components/ui/states";
import { roleAllows, type TeamRole } from "@/lib/access/roles";
import { ApiError, fetchJson } from "@/lib/client/api";
import { queryKeys } from "@/lib/client/queries";
import type { Scene } from "@/lib/fdtd/scene";
import type { SceneRecord } from "@/lib/http/api-types";

export function SceneEditPanel({
  record,
  role,
  onUnsavedChange,
}: {
  record: SceneRecord;
  role: TeamRole;
  /** Told whether there are unsaved edits, so that other views (the history's restore) can wait for them. */
  onUnsavedChange?: (unsaved: boolean) => void;
}) {
  const client = useQueryClient();
  const router = useRouter();
  const [draft, setDraft] = useState<Scene | null>(null);
  // The version the draft was started from. The record may be refetched meanwhile (window focus,
  // live updates); saving against the refetched version would overwrite a colleague's newer one
  // without the 409 that offers the user a choice.
  const [draftBaseVersion, setDraftBaseVersion] = useState<number | null>(null);
  const editDraft = (next: Scene) => {
    setDraftBaseVersion((base) => base ?? record.version);
    setDraft(next);
  };
  const dropDraft = () => {
    setDraft(null);
    setDraftBaseVersion(null);
  };
  const [note, setNote] = useState("");
  const [state, setState] = useState<"editing" | "saving" | "conflict">("editing");
  const [failure, setFailure] = useState<string | null>(null);
  const canEdit = roleAllows(role, "scene:edit");
  const unsaved = draft !== null;
  useEffect(() => onUnsavedChange?.(unsaved), [unsaved, onUnsavedChange]);

  const refresh = () =>
    Promise.all([
      client.invalidateQueries({ queryKey: queryKeys.scene(record.id) }),
      client.invalidateQueries({ queryKey: queryKeys.study(record.studyId) }),
      client.invalidateQueries({ queryKey: queryKeys.blocks(record.studyId) }),
    ]);

  async function save() {
    if (!draft) return;
    setState("saving");
    setFailure(null);
    try {
      await fetchJson(`/api/scenes/${record.id}`, {
        method: "PUT",
        json: { baseVersion: draftBaseVersion ?? record.version, name: record.name, description: record.description, data: draft, note },
      });
      await refresh();
      dropDraft();
      setNote("");
      setState("editing");
    } catch (error) {
      if (error instanceof ApiError && error.status === 409) setState("conflict");
      else {
        setFailure(error instanceof ApiError && error.issues.length ? error.issues.map((issue) => `${issue.path}: ${issue.message}`).join("; ") : (error as Error).message);
        setState("editing");
      }
    }
  }

  async function keepAsVariant() {
    if (!draft) return;
    const { scene } = await fetchJson<{ scene: SceneRecord }>(`/api/studies/${record.studyId}/scenes`, {
      method: "POST",
      json: { name: `${record.name} (variant)`.slice(0, 120), description: record.description, data: draft },
    });
    await refresh();
    router.push(`/studies/${record.studyId}/scenes/${scene.id}`);
  }

  return (
    <div className="flex flex-col gap-3">
      {canEdit ? (
        <div className="flex flex-wrap items-center gap-3">
          <input
            aria-label="Change note"
            placeholder="What changed? (optional)"
            value={note}
            onChange={(event) => setNote(event.target.value)}
            className="h-9 min-w-64 flex-1 rounded-md border border-rule-strong bg-panel px-3 text-sm focus:border-tide-500 focus:outline-none focus:ring-2 focus:ring-tide-500/20"
          />
          <span data-testid="edit-status" className="text-sm text-muted">
            {draft ? "Unsaved changes" : `Version ${record.version} saved`}
          </span>
          <Button onClick={save} disabled={!draft || state === "saving"}>
            {state === "saving" ? "Saving…" : "Save new version"}
          </Button>
        </div>
      ) : (
        <p className="text-sm text-muted">Your role can read this scene but not change it.</p>
      )}
      {state === "conflict" ? (
        <div role="alert" className="flex flex-wrap items-center gap-3 rounded-md border border-signal-error/30 bg-signal-error-50 px-3 py-2 text-sm">
          <span className="text-ink-soft">Someone saved a newer version while you edited. Your changes are kept here.</span>
          <Button size="sm" variant="secondary" onClick={async () => { dropDraft(); setState("editing"); await refresh(); }}>
            Load the latest (drop mine)
          </Button>
          <Button size="sm" onClick={keepAsVariant}>
            Keep mine as a new variant
          </Button>
        </div>
      ) : null}
      {failure ? <ErrorState title="The scene was not saved" message={failure} /> : null}
      {/* A fixed height, most of the window: the canvas keeps its size and the inspector scrolls inside it. */}
      <div className="h-[max(560px,calc(100dvh_-_16rem))]">
        <SceneEditor scene={draft ?? (record.data as Scene)} onChange={editDraft} readOnly={!canEdit} />
      </div>
    </div>
  );
}
