"use client";
// A token just made, shown this once: Rarefact keeps only a hash of the secret.
import { Button } from "@/components/ui/button";
import { useCopyOnce } from "@/components/ui/use-copy-once";

export function NewTokenBox({ name, secret, onDone }: { name: string; secret: string; onDone: () => void }) {
  const { field, copied, copy } = useCopyOnce(secret);

  return (
    <div role="status" className="flex flex-col gap-3 rounded-lg border border-ember-100 bg-ember-50 p-4" data-testid="new-api-token">
      <div>
        <p className="font-semibold text-ink">Copy the token “{name}” now</p>
        <p className="text-sm leading-relaxed text-ink-soft">
          This is the only time it is shown: Rarefact keeps only a hash of it. Whoever holds it can act as you in its team, up to its role, until it
          expires or you revoke it. Store it like a password; never put it in a shared file or a repository.
        </p>
      </div>
      <div className="flex gap-2">
        <input
          ref={field}
          readOnly
          value={secret}
          aria-label="API token secret"
          onFocus={(event) => event.currentTarget.select()}
          className="h-9 min-w-0 flex-1 rounded-md border border-rule-strong bg-panel px-2 font-mono text-[13px] text-ink"
        />
        <Button variant="secondary" size="sm" className="h-9" onClick={() => void copy()}>
          {copied === "yes" ? "Copied" : "Copy"}
        </Button>
      </div>
      {copied === "select" ? <p className="text-xs text-ink-soft">The browser did not allow copying: the token is selected, press Ctrl+C (⌘C on a Mac).</p> : null}
      <p className="text-xs text-ink-soft">
        Use it as <code className="font-mono">Authorization: Bearer …</code>; the API reference is under <a href="/api-docs" className="font-medium text-tide-700 underline underline-offset-2">API</a>.
      </p>
      <div>
        <Button size="sm" variant="quiet" onClick={onDone}>
          I have copied it
        </Button>
      </div>
    </div>
  );
}
