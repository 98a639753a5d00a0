"use client";
// Making a token: a name that says which script or machine uses it, the one team it reaches, a role
// within the caller's own there, and how long it lasts. The server checks the same schema and the role.
import { zodResolver } from "@hookform/resolvers/zod";
import { useEffect } from "react";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { ErrorState } from "@/components/ui/states";
import { FieldFrame, TextField } from "@/components/ui/text-field";
import { roleDescriptions, type TeamRole } from "@/lib/access/roles";
import { tokenRolesFor } from "@/lib/access/token-scope";
import { ApiError } from "@/lib/client/api";
import type { TeamMembershipSummary } from "@/lib/http/api-types";
import { apiTokenCreateSchema, type ApiTokenCreateInput } from "@/lib/validation/api-token";

type FormValues = z.input<typeof apiTokenCreateSchema>;
const fieldNames = ["name", "teamId", "role", "expiresInDays"] as const;
const lifetimes = [
  { days: 30, label: "30 days" },
  { days: 90, label: "90 days" },
  { days: 366, label: "One year" },
] as const;

export function ApiTokenForm({ memberships, activeTeamId, onCreate }: { memberships: TeamMembershipSummary[]; activeTeamId: string | null; onCreate: (input: ApiTokenCreateInput) => Promise<void> }) {
  const firstTeam = memberships.find((m) => m.teamId === activeTeamId) ?? memberships[0];
  const form = useForm<FormValues, unknown, ApiTokenCreateInput>({
    resolver: zodResolver(apiTokenCreateSchema),
    defaultValues: { name: "", teamId: firstTeam?.teamId ?? "", role: "viewer", expiresInDays: 90 },
  });
  const { errors, isSubmitting } = form.formState;
  const teamId = useWatch({ control: form.control, name: "teamId" });
  const chosenRole = useWatch({ control: form.control, name: "role" });
  const memberRole: TeamRole = memberships.find((m) => m.teamId === teamId)?.role ?? "viewer";
  const roles = tokenRolesFor(memberRole);

  // A role the chosen team does not allow falls back to read-only.
  useEffect(() => {
    if (!roles.includes(chosenRole as TeamRole)) form.setValue("role", "viewer");
  }, [roles, chosenRole, form]);

  const submit = form.handleSubmit(async (values) => {
    try {
      await onCreate(values);
      form.reset({ name: "", teamId: values.teamId, role: values.role, expiresInDays: values.expiresInDays });
    } catch (error) {
      if (error instanceof ApiError && error.issues.length > 0) {
        for (const issue of error.issues) form.setError(fieldNames.find((name) => name === issue.path) ?? "root", { message: issue.message });
      } else {
        form.setError("root", { message: error instanceof Error ? error.message : "The token was not made." });
      }
    }
  });

  return (
    <form onSubmit={submit} noValidate aria-label="New API token" className="flex h-fit flex-col gap-4 rounded-lg border border-rule bg-panel p-5 shadow-sm">
      <div>
        <h2 className="text-lg font-semibold text-ink">New token</h2>
        <p className="text-sm text-muted">For a script or a machine. It reaches one team, never with more rights than yours there.</p>
      </div>
      <TextField id="token-name" label="Name" placeholder="e.g. Nightly barrier sweep" maxLength={80} autoComplete="off" error={errors.name?.message} {...form.register("name")} />
      <FieldFrame id="token-team" label="Team" error={errors.teamId?.message}>
        <select id="token-team" className="h-10 w-full rounded-md border border-rule-strong bg-panel px-3 text-[15px] text-ink focus:border-tide-500 focus:outline-none focus:ring-2 focus:ring-tide-500/20" {...form.register("teamId")}>
          {memberships.map((m) => (
            <option key={m.teamId} value={m.teamId}>
              {m.teamName} (you: {m.role})
            </option>
          ))}
        </select>
      </FieldFrame>
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1.5 text-sm font-medium text-ink-soft">Role</legend>
        {roles.map((role) => (
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
        <p className="text-xs text-muted">If your own role in the team is lowered later, the token is lowered with it; if you leave the team, it stops working there.</p>
        {errors.role ? (
          <p role="alert" className="text-sm text-signal-error">
            {errors.role.message}
          </p>
        ) : null}
      </fieldset>
      <FieldFrame id="token-expiry" label="Expires after" error={errors.expiresInDays?.message}>
        <select
          id="token-expiry"
          className="h-10 w-full rounded-md border border-rule-strong bg-panel px-3 text-[15px] text-ink focus:border-tide-500 focus:outline-none focus:ring-2 focus:ring-tide-500/20"
          {...form.register("expiresInDays", { setValueAs: (value: unknown) => (value === "" || value === undefined ? undefined : Number(value)) })}
        >
          {lifetimes.map((lifetime) => (
            <option key={lifetime.days} value={lifetime.days}>
              {lifetime.label}
            </option>
          ))}
          <option value="">Never (revoke it yourself)</option>
        </select>
      </FieldFrame>
      {errors.root ? <ErrorState title="No token was made" message={errors.root.message ?? ""} /> : null}
      <Button type="submit" disabled={isSubmitting || memberships.length === 0}>
        {isSubmitting ? "Making the token…" : "Make token"}
      </Button>
    </form>
  );
}
