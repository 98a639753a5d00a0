// Who may delete a saved run. Not a plain role action: an editor may delete the runs they saved,
// not a colleague's; an owner may delete any. Reviewers and viewers never delete evidence.
import type { TeamRole } from "./roles";

export function mayDeleteRun({ role, callerId, createdById }: { role: TeamRole; callerId: string; createdById: string | null }): boolean {
  if (role === "owner") return true;
  return role === "editor" && createdById !== null && createdById === callerId;
}
