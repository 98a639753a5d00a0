"use client";
// The person's tokens: name, team, role, the secret's first characters, when made, last used and
// expiring. Revoking asks once more in place, since a script using the token stops at once.
import { useState } from "react";
import { RoleBadge } from "@/components/studies/role-badge";
import { Button } from "@/components/ui/button";
import { formatWhen } from "@/lib/client/format";
import type { ApiTokenItem } from "@/lib/http/api-token-types";

const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric" });

function tokenState(token: ApiTokenItem, now: Date): { text: string; tone: string } {
  if (token.revokedAt) return { text: `Revoked ${formatWhen(token.revokedAt, now)}`, tone: "text-signal-error" };
  if (token.expiresAt && new Date(token.expiresAt) <= now) return { text: `Expired ${dateFormat.format(new Date(token.expiresAt))}`, tone: "text-signal-error" };
  if (token.expiresAt) return { text: `Expires ${dateFormat.format(new Date(token.expiresAt))}`, tone: "text-ink-soft" };
  return { text: "Never expires", tone: "text-ink-soft" };
}

function RevokeButton({ token, busy, onConfirm }: { token: ApiTokenItem; busy: boolean; onConfirm: () => void }) {
  const [asking, setAsking] = useState(false);
  if (!asking) {
    return (
      <Button size="sm" variant="quiet" disabled={busy} onClick={() => setAsking(true)} aria-label={`Revoke the token ${token.name}`}>
        {busy ? "Revoking…" : "Revoke"}
      </Button>
    );
  }
  return (
    <div role="group" aria-label={`Confirm revoking ${token.name}`} className="flex flex-wrap items-center justify-end gap-2 text-sm">
      <span className="text-ink-soft">Scripts using it stop at once.</span>
      <Button
        size="sm"
        variant="danger"
        onClick={() => {
          setAsking(false);
          onConfirm();
        }}
      >
        Revoke
      </Button>
      <Button size="sm" variant="secondary" onClick={() => setAsking(false)}>
        Keep
      </Button>
    </div>
  );
}

export function ApiTokenList({ tokens, revokingId, onRevoke }: { tokens: ApiTokenItem[]; revokingId: string | null; onRevoke: (token: ApiTokenItem) => void }) {
  const now = new Date();
  if (tokens.length === 0) return <p className="text-sm text-muted">No API tokens yet. Make one for each script or machine, so you can revoke them one by one.</p>;
  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-panel">
      <table className="w-full text-left text-sm" aria-label="Your API tokens">
        <thead className="border-b border-rule bg-paper text-xs uppercase tracking-wide text-muted">
          <tr>
            <th scope="col" className="px-3 py-2 font-medium">Name</th>
            <th scope="col" className="px-3 py-2 font-medium">Team and role</th>
            <th scope="col" className="px-3 py-2 font-medium">Token</th>
            <th scope="col" className="px-3 py-2 font-medium">Made</th>
            <th scope="col" className="px-3 py-2 font-medium">Last used</th>
            <th scope="col" className="px-3 py-2 font-medium">Expiry</th>
            <th scope="col" className="px-3 py-2"><span className="sr-only">Actions</span></th>
          </tr>
        </thead>
        <tbody className="divide-y divide-rule">
          {tokens.map((token) => {
            const state = tokenState(token, now);
            const usable = !token.revokedAt && !(token.expiresAt && new Date(token.expiresAt) <= now);
            return (
              <tr key={token.id} data-testid="api-token-row" className={usable ? "" : "bg-paper/60"}>
                <td className={`px-3 py-2 font-medium ${usable ? "text-ink" : "text-muted line-through"}`}>{token.name}</td>
                <td className="px-3 py-2">
                  <div className="flex flex-wrap items-center gap-2">
                    <span className="text-ink-soft">{token.teamName}</span>
                    <RoleBadge role={token.role} />
                  </div>
                </td>
                <td className="px-3 py-2 font-mono text-[13px] text-ink-soft">{token.prefix}…</td>
                <td className="px-3 py-2 text-ink-soft">
                  <time dateTime={token.createdAt}>{formatWhen(token.createdAt, now)}</time>
                </td>
                <td className="px-3 py-2 text-ink-soft">{token.lastUsedAt ? <time dateTime={token.lastUsedAt}>{formatWhen(token.lastUsedAt, now)}</time> : "Never"}</td>
                <td className={`px-3 py-2 ${state.tone}`}>{state.text}</td>
                <td className="px-3 py-2 text-right">{usable ? <RevokeButton token={token} busy={revokingId === token.id} onConfirm={() => onRevoke(token)} /> : null}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
