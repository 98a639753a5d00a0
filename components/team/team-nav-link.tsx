"use client";
// The header's "Team" link: the active team's members, invitations and (for owners) mailbox.
import Link from "next/link";
import { usePathname } from "next/navigation";
import { useMe } from "@/lib/client/queries";

export function TeamNavLink() {
  const me = useMe();
  const pathname = usePathname();
  const teamId = me.data?.activeTeamId;
  if (!teamId) return null;
  const active = pathname.startsWith("/teams/");
  return (
    <Link
      href={`/teams/${teamId}`}
      aria-current={active ? "page" : undefined}
      className={`rounded-md px-3 py-1.5 font-medium transition-colors ${active ? "bg-white/12 text-white" : "text-white/70 hover:text-white"}`}
    >
      Team
    </Link>
  );
}
