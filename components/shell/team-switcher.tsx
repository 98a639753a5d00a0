"use client";
import { useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { authClient } from "@/lib/client/auth-client";
import { queryKeys, useMe } from "@/lib/client/queries";

/** The active team decides which studies the dashboard lists. */
export function TeamSwitcher() {
  const me = useMe();
  const client = useQueryClient();
  const router = useRouter();
  const [switching, setSwitching] = useState(false);
  if (!me.data || me.data.memberships.length === 0) return null;
  const { memberships, activeTeamId } = me.data;
  const active = memberships.find((m) => m.teamId === activeTeamId);

  if (memberships.length === 1) {
    return (
      <span className="hidden items-center gap-2 text-sm text-white/80 md:flex">
        {active?.teamName}
        <span className="rounded bg-white/10 px-1.5 py-0.5 text-[11px] uppercase tracking-wide text-white/70">{active?.role}</span>
      </span>
    );
  }

  return (
    <label className="flex items-center gap-2 text-sm">
      <span className="sr-only">Active team</span>
      <select
        value={activeTeamId ?? ""}
        disabled={switching}
        onChange={async (event) => {
          setSwitching(true);
          await authClient.organization.setActive({ organizationId: event.target.value });
          await client.invalidateQueries({ queryKey: queryKeys.me });
          setSwitching(false);
          router.push("/dashboard");
        }}
        className="h-8 rounded-md border border-white/15 bg-night-soft px-2 text-sm text-white focus:outline-none focus:ring-2 focus:ring-tide-300"
      >
        {memberships.map((m) => (
          <option key={m.teamId} value={m.teamId}>
            {m.teamName} ({m.role})
          </option>
        ))}
      </select>
    </label>
  );
}
