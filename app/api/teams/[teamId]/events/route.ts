// Live updates for a team's open pages (any member): every activity of the team, across its
// studies. Access is checked at the connect, with every ping and whenever the team's membership
// changes; a caller who lost it is disconnected.
import { roleAllows } from "@/lib/access/roles";
import { getCaller, getCallerRole, requireCaller, requireTeamAccess } from "@/lib/server/access";
import { activityMessage, isMembershipChange, openLiveStream } from "@/lib/server/live-stream";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

export const dynamic = "force-dynamic";
export const runtime = "nodejs";

interface Context {
  params: Promise<{ teamId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const teamId = parseWith(idSchema, (await params).teamId, "team");
  const caller = await requireCaller(request.headers);
  await requireTeamAccess({ caller, teamId, action: "team:read" });

  return openLiveStream({
    request,
    select: async (event) => (event.kind === "activity" && event.teamId === teamId ? activityMessage(event) : null),
    recheckAfter: (event) => isMembershipChange(event, teamId),
    stillAllowed: async () => {
      // The same session or token as at the connect (a revoked or expired token throws: the stream ends).
      const session = await getCaller(request.headers);
      if (session?.userId !== caller.userId || session.token?.id !== caller.token?.id) return false;
      const role = await getCallerRole({ caller: session, teamId });
      return role !== null && roleAllows(role, "team:read");
    },
  });
});
