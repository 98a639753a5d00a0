import type { TeamRole } from "@/lib/access/roles";
import { roleDescriptions } from "@/lib/access/roles";

const tones: Record<TeamRole, string> = {
  owner: "bg-tide-50 text-tide-700 ring-tide-300/60",
  editor: "bg-tide-50 text-tide-700 ring-tide-300/60",
  reviewer: "bg-ember-50 text-ember-700 ring-ember-100",
  viewer: "bg-paper text-ink-soft ring-rule-strong",
};

export function RoleBadge({ role }: { role: TeamRole }) {
  return (
    <span title={roleDescriptions[role]} className={`inline-flex items-center rounded-full px-2.5 py-0.5 text-xs font-medium capitalize ring-1 ${tones[role]}`}>
      {role}
    </span>
  );
}
