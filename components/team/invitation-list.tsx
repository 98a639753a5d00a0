"use client";
// The team's invitations, open ones first. Owners withdraw them here; there is nothing to copy:
// a link only ever travels in its e-mail (read in the mailbox when no SMTP server is set up).
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { LoadFailure } from "@/components/ui/load-failure";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import type { InvitationState } from "@/lib/collaboration/membership-rules";
import { formatWhen } from "@/lib/client/format";
import { useTeamInvitations, useTeamMutations } from "@/lib/client/team-queries";
import type { TeamInvitationItem } from "@/lib/http/team-types";

const stateOrder: Record<InvitationState, number> = { pending: 0, expired: 1, accepted: 2, revoked: 3 };

const stateLabels: Record<InvitationState, { label: string; tone: string }> = {
  pending: { label: "Waiting", tone: "bg-tide-50 text-tide-700 ring-tide-300/60" },
  expired: { label: "Expired", tone: "bg-[#fdf6e7] text-signal-warn ring-signal-warn/30" },
  accepted: { label: "Joined", tone: "bg-paper text-signal-ok ring-rule-strong" },
  revoked: { label: "Withdrawn", tone: "bg-paper text-muted ring-rule-strong" },
};

const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit" });

function whenLine(item: TeamInvitationItem): string {
  const by = item.inviterName ? ` by ${item.inviterName}` : "";
  switch (item.state) {
    case "pending":
      return `Invited ${formatWhen(item.createdAt)}${by} · link valid until ${dateFormat.format(new Date(item.expiresAt))}`;
    case "expired":
      return `Invited ${formatWhen(item.createdAt)}${by} · expired ${formatWhen(item.expiresAt)}`;
    case "accepted":
      return `Joined ${item.acceptedAt ? formatWhen(item.acceptedAt) : ""}${item.acceptedByName ? ` as ${item.acceptedByName}` : ""}`;
    case "revoked":
      return `Invited ${formatWhen(item.createdAt)}${by} · withdrawn`;
  }
}

export function InvitationList({ teamId }: { teamId: string }) {
  const invitations = useTeamInvitations(teamId, true);
  const { revoke } = useTeamMutations(teamId);
  const [problem, setProblem] = useState<string | null>(null);
  const [showClosed, setShowClosed] = useState(false);

  if (invitations.isPending) return <LoadingRows rows={1} label="Loading invitations" />;
  if (invitations.isError) return <LoadFailure subject="invitation list" error={invitations.error} onRetry={() => invitations.refetch()} />;

  const sorted = [...invitations.data.invitations].sort((a, b) => stateOrder[a.state] - stateOrder[b.state]);
  const open = sorted.filter((item) => item.state === "pending" || item.state === "expired");
  const closed = sorted.filter((item) => item.state === "accepted" || item.state === "revoked");
  const shown = showClosed ? sorted : open;

  return (
    <section aria-labelledby="invitations-heading" className="flex flex-col gap-3">
      <div className="flex items-baseline justify-between gap-3">
        <h2 id="invitations-heading" className="text-lg font-semibold text-ink">
          Invitations <span className="text-sm font-normal text-muted">({open.length} open)</span>
        </h2>
        {closed.length > 0 ? (
          <button type="button" onClick={() => setShowClosed((value) => !value)} className="text-sm font-medium text-tide-600 hover:underline">
            {showClosed ? "Hide used and withdrawn" : `Show used and withdrawn (${closed.length})`}
          </button>
        ) : null}
      </div>
      {problem ? <ErrorState title="Not withdrawn" message={problem} /> : null}
      {shown.length === 0 ? (
        <p className="rounded-lg border border-dashed border-rule-strong bg-panel/60 px-4 py-3 text-sm text-muted">No open invitations.</p>
      ) : (
        <ul aria-label="Invitations" className="divide-y divide-rule rounded-lg border border-rule bg-panel">
          {shown.map((item) => (
            <li key={item.id} className="flex flex-wrap items-center gap-x-4 gap-y-2 px-4 py-3">
              <div className="min-w-0 flex-1">
                <p className="truncate text-sm font-medium text-ink">
                  {item.email} <span className="font-normal capitalize text-muted">· {item.role}</span>
                </p>
                <p className="truncate text-xs text-muted">{whenLine(item)}</p>
              </div>
              <span className={`rounded-full px-2.5 py-0.5 text-xs font-medium ring-1 ${stateLabels[item.state].tone}`}>{stateLabels[item.state].label}</span>
              {item.state === "pending" || item.state === "expired" ? (
                <Button
                  size="sm"
                  variant="quiet"
                  disabled={revoke.isPending}
                  onClick={async () => {
                    setProblem(null);
                    try {
                      await revoke.mutateAsync(item.id);
                    } catch (error) {
                      setProblem(error instanceof Error ? error.message : "The invitation could not be withdrawn.");
                    }
                  }}
                >
                  Withdraw
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
