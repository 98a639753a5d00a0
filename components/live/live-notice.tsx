"use client";
// A quiet notice when a colleague does something on the open study ("Priya pinned a comment on
// …"). The region stays mounted so that screen readers announce each new sentence politely.
import { ActivitySentenceText } from "@/components/activity/activity-sentence";
import { describeActivity } from "@/lib/collaboration/activity-sentences";
import type { LiveNotice as Notice } from "@/lib/client/use-live-updates";

export function LiveNotice({ notice, viewerId, onDismiss }: { notice: Notice | null; viewerId: string | null; onDismiss: () => void }) {
  return (
    <div aria-live="polite" aria-atomic="true" className="pointer-events-none fixed bottom-4 right-4 z-40 flex max-w-sm flex-col items-end print:hidden">
      {notice ? (
        <div key={notice.id} className="pointer-events-auto flex items-start gap-3 rounded-lg border border-rule bg-panel px-4 py-3 text-sm shadow-lg" data-testid="live-notice">
          <span aria-hidden className="mt-1.5 size-2 shrink-0 rounded-full bg-tide-500" />
          <p className="text-ink-soft">
            <ActivitySentenceText sentence={describeActivity(notice.item, { viewerId })} />
          </p>
          <button type="button" onClick={onDismiss} className="-mr-1 rounded px-1 text-muted hover:text-ink" aria-label="Dismiss the notice">
            ×
          </button>
        </div>
      ) : null}
    </div>
  );
}
