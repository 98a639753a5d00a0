"use client";
// The team's kept e-mail (owners only): every invitation and notice Rarefact wrote, whether it was
// sent, only kept (no SMTP settings) or failed, with the selected message's content beside the list.
import { useState } from "react";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { LoadFailure } from "@/components/ui/load-failure";
import { EmptyState, ErrorState, LoadingRows } from "@/components/ui/states";
import { useTeamMail } from "@/lib/client/team-queries";
import { MailMessageList } from "./mail-message-list";
import { MailMessageView } from "./mail-message-view";

export function MailboxView({ teamId, teamName, allowed }: { teamId: string; teamName: string; allowed: boolean }) {
  const header = (
    <div className="flex flex-col gap-2">
      <Breadcrumb links={[{ href: `/teams/${teamId}`, label: teamName }]} current="Mailbox" />
      <h1 className="text-[28px] font-semibold leading-tight text-ink">Mailbox</h1>
      <p className="max-w-3xl text-sm text-muted">
        Every e-mail Rarefact writes for this team is kept here. Without SMTP settings (<code className="font-mono text-[13px]">RAREFACT_SMTP_URL</code>) messages
        are kept here instead of sent, so invitations can be passed on by hand.
      </p>
    </div>
  );
  if (!allowed) {
    return (
      <div className="flex flex-col gap-6">
        {header}
        <ErrorState title="Only owners read the mailbox" message="The kept e-mail holds invitation links; ask an owner of the team if you need one." />
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-6">
      {header}
      <MailboxContent teamId={teamId} />
    </div>
  );
}

function MailboxContent({ teamId }: { teamId: string }) {
  const mail = useTeamMail(teamId);
  const [selectedId, setSelectedId] = useState<string | null>(null);
  if (mail.isPending) return <LoadingRows rows={3} label="Loading the mailbox" />;
  if (mail.isError) return <LoadFailure subject="mailbox" error={mail.error} onRetry={() => mail.refetch()} />;
  const { messages, mode } = mail.data;
  if (messages.length === 0) {
    return <EmptyState title="No e-mail yet">Invitations, mentions and review notices appear here as soon as they are written.</EmptyState>;
  }
  const selected = messages.find((message) => message.id === selectedId) ?? messages[0]!;
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-ink-soft">
        {mode === "smtp" ? "A mail server is set up: messages are sent, and a copy is kept here." : "No mail server is set up: messages are only kept here."}
      </p>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
        <MailMessageList messages={messages} selectedId={selected.id} onSelect={setSelectedId} />
        <MailMessageView message={selected} />
      </div>
    </div>
  );
}
