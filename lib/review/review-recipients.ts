// Who is told of a review step by e-mail. A request goes to everyone who can decide (reviewers and
// owners); a decision goes back to the run's author and to whoever asked for the review. Nobody is
// told of their own step, and only current members of the team are written to.
import type { TeamRole } from "@/lib/access/roles";
import type { ReviewCommand } from "./review-rules";

export interface TeamMemberAddress {
  userId: string;
  name: string;
  email: string;
  role: TeamRole;
}

export function reviewMailRecipients({
  command,
  actorId,
  runCreatorId,
  requesterId,
  members,
}: {
  command: ReviewCommand;
  actorId: string;
  runCreatorId: string | null;
  /** Who asked for the latest review, if anyone. */
  requesterId: string | null;
  members: readonly TeamMemberAddress[];
}): TeamMemberAddress[] {
  const others = members.filter((member) => member.userId !== actorId);
  if (command === "request_review") return others.filter((member) => member.role === "reviewer" || member.role === "owner");
  const concerned = new Set([runCreatorId, requesterId].filter((id): id is string => id !== null));
  return others.filter((member) => concerned.has(member.userId));
}
