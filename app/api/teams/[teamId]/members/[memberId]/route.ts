// One member of a team, named by their user id: an owner changes their role or removes them;
// anyone may remove themselves (leave). The team always keeps an owner (409 otherwise).
import { recordActivity } from "@/db/queries/activity";
import { changeMemberRole, removeMember } from "@/db/queries/teams";
import { AppError } from "@/lib/http/app-error";
import type { TeamMemberResponse } from "@/lib/http/team-types";
import { requireCaller, requireTeamAccess } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";
import { roleChangeSchema } from "@/lib/validation/team";

interface Context {
  params: Promise<{ teamId: string; memberId: string }>;
}

async function parseIds(params: Context["params"]) {
  const { teamId, memberId } = await params;
  return { teamId: parseWith(idSchema, teamId, "team"), memberId: parseWith(idSchema, memberId, "member") };
}

export const PATCH = apiRoute<Context>(async (request, { params }) => {
  const { teamId, memberId } = await parseIds(params);
  const caller = await requireCaller(request.headers);
  const { role: callerRole } = await requireTeamAccess({ caller, teamId, action: "team:manage-members" });
  const { role } = await parseJsonBody(request, roleChangeSchema, "member");
  const { member, fromRole } = await changeMemberRole({ teamId, userId: memberId, role, callerRole });
  if (fromRole !== role) {
    await recordActivity({
      teamId,
      actorId: caller.userId,
      action: "member.role_changed",
      subjectType: "member",
      subjectId: member.userId,
      detail: { memberName: member.name, email: member.email, fromRole, toRole: role },
    });
  }
  const body: TeamMemberResponse = { member };
  return Response.json(body);
});

export const DELETE = apiRoute<Context>(async (request, { params }) => {
  const { teamId, memberId } = await parseIds(params);
  const caller = await requireCaller(request.headers);
  // Leaving needs only membership; removing someone else needs the owner's action.
  const leaving = memberId === caller.userId;
  if (leaving && caller.token) throw new AppError("forbidden:token", "An API token cannot take its owner off the team; leave the team on the team page.");
  const { role: callerRole } = await requireTeamAccess({ caller, teamId, action: leaving ? "team:read" : "team:manage-members" });
  const member = await removeMember({ teamId, userId: memberId, callerUserId: caller.userId, callerRole });
  await recordActivity({
    teamId,
    actorId: caller.userId,
    action: "member.removed",
    subjectType: "member",
    subjectId: member.userId,
    detail: { memberName: member.name, email: member.email, role: member.role, left: leaving },
  });
  const body: TeamMemberResponse = { member };
  return Response.json(body);
});
