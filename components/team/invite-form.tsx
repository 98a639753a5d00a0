"use client";
// Invite someone by e-mail with a role. The link goes only into the e-mail; the form says whether
// the e-mail was sent, kept in the mailbox (no SMTP settings) or failed (the invitation stands).
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { ErrorState } from "@/components/ui/states";
import { TextField } from "@/components/ui/text-field";
import { roleDescriptions, teamRoles } from "@/lib/access/roles";
import { ApiError } from "@/lib/client/api";
import { useHydrated } from "@/lib/client/use-hydrated";
import { useTeamMutations } from "@/lib/client/team-queries";
import type { CreatedInvitationResponse } from "@/lib/http/team-types";
import { invitationInputSchema, type InvitationFormValues, type InvitationInput } from "@/lib/validation/team";

const fieldNames = ["email", "role"] as const;

function outcomeText({ invitation, mail }: CreatedInvitationResponse): { tone: "ok" | "warn"; text: string } {
  if (mail.status === "sent") return { tone: "ok", text: `Invitation e-mailed to ${invitation.email}.` };
  if (mail.status === "kept") return { tone: "ok", text: `Invitation made for ${invitation.email}. No mail server is set up, so the e-mail is kept in the team mailbox.` };
  return {
    tone: "warn",
    text: `Invitation made for ${invitation.email}, but the e-mail could not be sent (${mail.error ?? "unknown reason"}). It is kept in the team mailbox; withdraw and invite again once mail works.`,
  };
}

export function InviteForm({ teamId }: { teamId: string }) {
  const { invite } = useTeamMutations(teamId);
  const hydrated = useHydrated();
  const [outcome, setOutcome] = useState<ReturnType<typeof outcomeText> | null>(null);
  const form = useForm<InvitationFormValues, unknown, InvitationInput>({
    resolver: zodResolver(invitationInputSchema),
    defaultValues: { email: "", role: "editor" },
  });
  const { errors, isSubmitting } = form.formState;
  const chosenRole = useWatch({ control: form.control, name: "role" });

  const onSubmit = form.handleSubmit(async (values) => {
    setOutcome(null);
    try {
      const created = await invite.mutateAsync(values);
      setOutcome(outcomeText(created));
      form.reset({ email: "", role: values.role });
    } catch (error) {
      // Keep what was typed; put the server's words beside the field they name.
      if (error instanceof ApiError && error.issues.length > 0) {
        for (const issue of error.issues) {
          const field = fieldNames.find((name) => name === issue.path);
          form.setError(field ?? "root", { message: issue.message });
        }
      } else {
        form.setError("root", { message: error instanceof Error ? error.message : "The invitation could not be made." });
      }
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Invite someone" className="flex h-fit flex-col gap-4 rounded-lg border border-rule bg-panel p-5 shadow-sm">
      <div>
        <h2 className="text-lg font-semibold text-ink">Invite someone</h2>
        <p className="text-sm text-muted">They get an e-mail with a link that works once and expires after a few days.</p>
      </div>
      <TextField id="invite-email" label="E-mail" type="email" autoComplete="off" placeholder="name@example.com" error={errors.email?.message} {...form.register("email")} />
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1.5 text-sm font-medium text-ink-soft">Role</legend>
        {teamRoles.map((role) => (
          <label
            key={role}
            className={`flex cursor-pointer gap-3 rounded-md border px-3 py-2 text-sm transition-colors ${chosenRole === role ? "border-tide-500 bg-tide-50" : "border-rule hover:border-rule-strong"}`}
          >
            <input type="radio" value={role} className="mt-1 accent-tide-600" {...form.register("role")} />
            <span>
              <span className="font-medium capitalize text-ink">{role}</span>
              <span className="block text-muted">{roleDescriptions[role]}</span>
            </span>
          </label>
        ))}
        {errors.role ? (
          <p role="alert" className="text-sm text-signal-error">
            {errors.role.message}
          </p>
        ) : null}
      </fieldset>
      {errors.root ? <ErrorState title="No invitation was made" message={errors.root.message ?? ""} /> : null}
      {outcome ? (
        <p role="status" className={`rounded-md px-3 py-2 text-sm ${outcome.tone === "ok" ? "bg-tide-50 text-tide-700" : "bg-[#fdf6e7] text-ink-soft"}`}>
          {outcome.text}{" "}
          <Link href={`/teams/${teamId}/mailbox`} className="font-medium underline underline-offset-2">
            Open the mailbox
          </Link>
        </p>
      ) : null}
      <Button type="submit" disabled={isSubmitting || !hydrated}>
        {isSubmitting ? "Inviting…" : "Send invitation"}
      </Button>
    </form>
  );
}
