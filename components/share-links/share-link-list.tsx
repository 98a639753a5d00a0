"use client";
// A study's read-only links: who each is for, who made it and when, and whether it still works. Revoking
// asks first, since whoever holds the link loses it at once.
import { Button } from "@/components/ui/button";
import { formatWhen } from "@/lib/client/format";
import type { ShareLinkItem } from "@/lib/http/share-link-types";

export function ShareLinkList({ links, revokingId, onRevoke }: { links: ShareLinkItem[]; revokingId: string | null; onRevoke: (link: ShareLinkItem) => void }) {
  if (links.length === 0) return <p className="text-sm text-muted">No read-only links yet.</p>;
  return (
    <ul aria-label="Read-only links" className="flex flex-col divide-y divide-rule">
      {links.map((link) => (
        <li key={link.id} data-testid="share-link-row" className="flex items-start gap-2 py-2 first:pt-0 last:pb-0">
          <div className="min-w-0 flex-1 text-sm">
            <p className={`truncate font-medium ${link.revokedAt ? "text-muted line-through" : "text-ink"}`} title={link.label}>
              {link.label || "Unlabelled link"}
            </p>
            <p className="text-xs text-muted">
              Made by {link.createdByName ?? "a former member"}, <time dateTime={link.createdAt}>{formatWhen(link.createdAt)}</time>
            </p>
            {link.revokedAt ? (
              <p className="text-xs text-signal-error">
                Revoked by {link.revokedByName ?? "a former member"}, <time dateTime={link.revokedAt}>{formatWhen(link.revokedAt)}</time>
              </p>
            ) : (
              <p className="text-xs text-tide-700">Opens the study read-only</p>
            )}
          </div>
          {link.revokedAt ? null : (
            <Button size="sm" variant="quiet" disabled={revokingId === link.id} onClick={() => onRevoke(link)} aria-label={`Revoke the link for ${link.label}`}>
              {revokingId === link.id ? "Revoking…" : "Revoke"}
            </Button>
          )}
        </li>
      ))}
    </ul>
  );
}
