"use client";
// A notes block: Markdown rendered for reading; for editors a text area that saves itself a
// moment after typing stops. A stale save (409) keeps the typed text and offers both ways out.
import { useEffect, useRef, useState } from "react";
import ReactMarkdown from "react-markdown";
import remarkGfm from "remark-gfm";
import { Button } from "@/components/ui/button";
import { ApiError } from "@/lib/client/api";
import type { BlockItem } from "@/lib/http/api-types";

const autosaveDelayMs = 900;

export function NotesBlock({
  block,
  canEdit,
  onSave,
  onKeepAsNew,
  onReload,
}: {
  block: BlockItem;
  canEdit: boolean;
  onSave: (markdown: string, baseVersion: number) => Promise<BlockItem>;
  onKeepAsNew: (markdown: string) => Promise<void>;
  onReload: () => Promise<void>;
}) {
  const saved = (block.content as { markdown: string }).markdown;
  const [editing, setEditing] = useState(false);
  const [draft, setDraft] = useState(saved);
  const [status, setStatus] = useState<"saved" | "typing" | "saving" | "conflict" | "failed">("saved");
  const [failure, setFailure] = useState("");
  const baseVersion = useRef(block.version);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);

  // Editing starts from the text and version on screen; later saves carry the version forward.
  function startEditing() {
    setDraft(saved);
    baseVersion.current = block.version;
    setStatus("saved");
    setEditing(true);
  }

  async function save(text: string) {
    setStatus("saving");
    try {
      const updated = await onSave(text, baseVersion.current);
      baseVersion.current = updated.version;
      setStatus("saved");
    } catch (error) {
      if (error instanceof ApiError && error.status === 409) setStatus("conflict");
      else {
        setFailure(error instanceof Error ? error.message : "The text was not saved.");
        setStatus("failed");
      }
    }
  }

  function change(text: string) {
    setDraft(text);
    setStatus("typing");
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => void save(text), autosaveDelayMs);
  }

  useEffect(() => () => {
    if (timer.current) clearTimeout(timer.current);
  }, []);

  return (
    <div className="flex flex-col gap-3">
      {editing && canEdit ? (
        <>
          <textarea
            aria-label="Notes (Markdown)"
            value={draft}
            onChange={(event) => change(event.target.value)}
            className="min-h-40 w-full rounded-md border border-rule-strong bg-panel p-3 font-mono text-[13px] leading-relaxed text-ink focus:border-tide-500 focus:outline-none focus:ring-2 focus:ring-tide-500/20"
          />
          <div className="flex items-center justify-between gap-3 text-sm">
            <span data-testid="notes-status" className={status === "conflict" || status === "failed" ? "text-signal-error" : "text-muted"}>
              {status === "saved" ? "Saved" : status === "saving" ? "Saving…" : status === "typing" ? "Editing…" : status === "conflict" ? "Someone else changed this block." : failure}
            </span>
            <Button size="sm" variant="secondary" onClick={() => setEditing(false)} disabled={status === "typing" || status === "saving"}>
              Done
            </Button>
          </div>
          {status === "conflict" ? (
            <div role="alert" className="flex flex-wrap items-center gap-3 rounded-md border border-signal-error/30 bg-signal-error-50 px-3 py-2 text-sm">
              <span className="text-ink-soft">Your text is kept here. Choose what to do with it:</span>
              <Button size="sm" variant="secondary" onClick={async () => { setStatus("saved"); setEditing(false); await onReload(); }}>
                Load their version
              </Button>
              <Button size="sm" onClick={async () => { await onKeepAsNew(draft); setStatus("saved"); setEditing(false); await onReload(); }}>
                Keep mine as a new block
              </Button>
            </div>
          ) : null}
        </>
      ) : (
        <div className="notes-prose" onDoubleClick={() => canEdit && startEditing()}>
          {saved.trim() ? <ReactMarkdown remarkPlugins={[remarkGfm]}>{saved}</ReactMarkdown> : <p className="text-muted">Empty notes.</p>}
        </div>
      )}
      {canEdit && !editing ? (
        <div>
          <Button size="sm" variant="quiet" onClick={startEditing}>
            Edit notes
          </Button>
        </div>
      ) : null}
    </div>
  );
}
