"use client";
// Removing someone (or leaving) asks once more in place: a slip of the mouse must not cost a colleague their access.
import { useState } from "react";
import { Button } from "@/components/ui/button";

export function RemoveMemberButton({ name, leaving, busy, onConfirm }: { name: string; leaving: boolean; busy: boolean; onConfirm: () => void }) {
  const [asking, setAsking] = useState(false);
  if (!asking) {
    return (
      <Button size="sm" variant="quiet" onClick={() => setAsking(true)}>
        {leaving ? "Leave team" : "Remove"}
      </Button>
    );
  }
  return (
    <div role="group" aria-label={leaving ? "Confirm leaving" : `Confirm removing ${name}`} className="flex items-center gap-2 text-sm">
      <span className="text-ink-soft">{leaving ? "Leave this team?" : `Remove ${name}?`}</span>
      <Button
        size="sm"
        variant="danger"
        disabled={busy}
        onClick={() => {
          setAsking(false);
          onConfirm();
        }}
      >
        {leaving ? "Leave" : "Remove"}
      </Button>
      <Button size="sm" variant="secondary" onClick={() => setAsking(false)}>
        Keep
      </Button>
    </div>
  );
}
