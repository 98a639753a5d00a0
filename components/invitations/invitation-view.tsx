"use client";
// The page an invitation link opens: what the link offers, and the one next step for whoever
// opened it (sign in or create an account, join, or switch to the invited account).
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button, buttonClasses } from "@/components/ui/button";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { roleDescriptions } from "@/lib/access/roles";
import { ApiError } from "@/lib/client/api";
import { authClient } from "@/lib/client/auth-client";
import { useAcceptInvitation, useInvitation } from "@/lib/client/team-queries";
import type { InvitationDescription } from "@/lib/http/team-types";

const expiryFormat = new Intl.DateTimeFormat("en-GB", { weekday: "long", day: "numeric", month: "long", year: "numeric", hour: "2-digit", minute: "2-digit" });

function unavailableTitle(error: Error): string {
  if (!(error instanceof ApiError)) return "The invitation could not be loaded";
  if (error.status === 410) return "This invitation has expired";
  if (error.status === 400) return "This is not an invitation link";
  if (error.status === 404) return "This invitation cannot be used";
  return "The invitation could not be loaded";
}

export function InvitationView({ token }: { token: string }) {
  const invitation = useInvitation(token);
  const returnTo = `/invitations/${token}`;

  if (invitation.isPending) return <LoadingRows rows={1} label="Reading the invitation" />;
  if (invitation.isError) {
    const retry = invitation.error instanceof ApiError && invitation.error.status >= 500 ? () => invitation.refetch() : undefined;
    return (
      <div className="flex flex-col gap-6">
        <h1 className="text-2xl font-semibold text-ink">Invitation</h1>
        <ErrorState title={unavailableTitle(invitation.error)} message={invitation.error.message} onRetry={retry} />
        <Link href="/dashboard" className="text-sm font-medium text-tide-600 hover:underline">
          Go to your studies
        </Link>
      </div>
    );
  }

  const described = invitation.data.invitation;
  return (
    <div className="flex flex-col gap-6">
      <header>
        <p className="text-sm font-medium text-tide-600">Invitation</p>
        <h1 className="mt-1 text-2xl font-semibold text-ink">Join {described.teamName}</h1>
      </header>
      <InvitationFacts invitation={described} />
      <NextStep invitation={described} token={token} returnTo={returnTo} />
    </div>
  );
}

function InvitationFacts({ invitation }: { invitation: InvitationDescription }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 rounded-lg border border-rule bg-panel p-4 text-sm">
      <dt className="text-muted">Team</dt>
      <dd className="font-medium text-ink">{invitation.teamName}</dd>
      <dt className="text-muted">Invited by</dt>
      <dd className="text-ink-soft">{invitation.inviterName ?? "a former member"}</dd>
      <dt className="text-muted">For</dt>
      <dd className="break-all text-ink-soft">{invitation.email}</dd>
      <dt className="text-muted">Role</dt>
      <dd className="text-ink-soft">
        <span className="font-medium capitalize text-ink">{invitation.role}</span>: {roleDescriptions[invitation.role]}
      </dd>
      <dt className="text-muted">Link valid until</dt>
      <dd className="text-ink-soft">{expiryFormat.format(new Date(invitation.expiresAt))}</dd>
    </dl>
  );
}

function NextStep({ invitation, token, returnTo }: { invitation: InvitationDescription; token: string; returnTo: string }) {
  const router = useRouter();
  const accept = useAcceptInvitation(token);
  const [switching, setSwitching] = useState(false);
  const next = encodeURIComponent(returnTo);

  if (invitation.signedInEmail === null) {
    return (
      <div className="flex flex-col gap-3">
        <p className="text-[15px] text-ink-soft">
          Sign in as <strong className="text-ink">{invitation.email}</strong> to join, or create an account with that address. You come back here afterwards.
        </p>
        <div className="flex flex-wrap gap-3">
          <Link href={`/sign-in?next=${next}`} className={buttonClasses("primary")}>
            Sign in
          </Link>
          <Link href={`/sign-up?next=${next}&email=${encodeURIComponent(invitation.email)}`} className={buttonClasses("secondary")}>
            Create an account
          </Link>
        </div>
      </div>
    );
  }

  if (invitation.alreadyMember) {
    return (
      <div className="flex flex-col gap-3">
        <p className="text-[15px] text-ink-soft">You are already on {invitation.teamName}. Switch to it with the team menu at the top of the studies page.</p>
        <Link href="/dashboard" className={buttonClasses("primary")}>
          Go to your studies
        </Link>
      </div>
    );
  }

  if (!invitation.emailMatches) {
    return (
      <div className="flex flex-col gap-3">
        <ErrorState
          title="Signed in with another address"
          message={`This invitation is for ${invitation.email}, but you are signed in as ${invitation.signedInEmail}. Sign out, then sign in or create an account with the invited address.`}
        />
        <Button
          variant="secondary"
          disabled={switching}
          onClick={async () => {
            setSwitching(true);
            await authClient.signOut();
            router.replace(`/sign-in?next=${next}`);
            router.refresh();
          }}
        >
          {switching ? "Signing out…" : "Sign out and use another account"}
        </Button>
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-3">
      {accept.isError ? <ErrorState title="You have not joined" message={accept.error.message} /> : null}
      <Button
        disabled={accept.isPending || accept.isSuccess}
        onClick={() =>
          accept.mutate(undefined, {
            onSuccess: () => {
              router.push("/dashboard");
              router.refresh();
            },
          })
        }
      >
        {accept.isPending || accept.isSuccess ? "Joining…" : `Join ${invitation.teamName}`}
      </Button>
      <p className="text-sm text-muted">The team becomes your active team; your other teams stay in the team menu.</p>
    </div>
  );
}
