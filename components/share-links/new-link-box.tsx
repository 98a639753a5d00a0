"use client";
// A link just made, shown this once: its URL holds the secret, and Rarefact keeps only a hash of it.
import { Button } from "@/components/ui/button";
import { useCopyOnce } from "@/components/ui/use-copy-once";

export function NewLinkBox({ label, url, onDone }: { label: string; url: string; onDone: () => void }) {
  const { field, copied, copy } = useCopyOnce(url);

  return (
    <div role="status" className="flex flex-col gap-2 rounded-md border border-tide-300 bg-tide-50 p-3" data-testid="new-share-link">
      <p className="text-sm font-medium text-ink">Link for {label}</p>
      <div className="flex gap-2">
        <input
          ref={field}
          readOnly
          value={url}
          aria-label="Read-only link"
          onFocus={(event) => event.currentTarget.select()}
          className="h-8 min-w-0 flex-1 rounded-md border border-rule-strong bg-panel px-2 font-mono text-[12px] text-ink"
        />
        <Button size="sm" variant="secondary" onClick={() => void copy()}>
          {copied === "yes" ? "Copied" : "Copy"}
        </Button>
      </div>
      <p className="text-xs leading-relaxed text-ink-soft">
        {copied === "select" ? "The browser did not allow copying: the link is selected, press Ctrl+C (⌘C on a Mac). " : ""}
        Copy it now: this is the only time it is shown. If it is lost, make a new one and revoke this one.
      </p>
      <div>
        <Button size="sm" variant="quiet" onClick={onDone}>
          Done
        </Button>
      </div>
    </div>
  );
}
