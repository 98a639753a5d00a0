// The access decision itself, free of I/O so that the whole role x action matrix can be tested.
import { roleAllows, type TeamAction, type TeamRole } from "./roles";

export type AccessDecision = "allow" | "unauthenticated" | "not_found" | "forbidden";

/**
 * signedIn: whether the caller has a session. role: the caller's role in the team that owns the
 * thing asked for, or null when the caller is not a member. Non-members are told the thing does
 * not exist, so that another team's study ids reveal nothing.
 */
export function decideAccess({ signedIn, role, action }: { signedIn: boolean; role: TeamRole | null; action: TeamAction }): AccessDecision {
  if (!signedIn) return "unauthenticated";
  if (role === null) return "not_found";
  return roleAllows(role, action) ? "allow" : "forbidden";
}
