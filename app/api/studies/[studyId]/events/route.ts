// Live updates for one study's open pages (any member): its activity, the activity about its runs,
// and who else has it open. Access is checked at the connect, with every ping and whenever the
// team's membership changes; a caller who lost it is disconnected.
import { getRunById } from "@/db/queries/runs";
import { publishLiveEvent } from "@/db/queries/live-events";
import { joinStudyPresence, leaveStudyPresence, newPresenceId, touchStudyPresence } from "@/db/queries/presence";
import { roleAllows } from "@/lib/access/roles";
import type { PresenceStreamMessage } from "@/lib/http/activity-types";
import type { LiveEvent } from "@/lib/live/live-event";
import { getCaller, getCallerRole, requireCaller, requireStudyAccess } from "@/lib/server/access";
import { activityMessage, isMembershipChange, jobMessage, openLiveStream } from "@/lib/server/live-stream";
import { apiRoute, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";

export const dynamic = "force-dynamic";
export const runtime = "nodejs";

interface Context {
  params: Promise<{ studyId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const studyId = parseWith(idSchema, (await params).studyId, "study");
  const caller = await requireCaller(request.headers);
  const { study } = await requireStudyAccess({ caller, studyId, action: "study:read" });
  const teamId = study.teamId;
  const presenceId = newPresenceId();

  // Comments and reviews may be recorded against a run alone: whether that run is this study's is
  // looked up once per run and connection.
  const runsInStudy = new Map<string, Promise<boolean>>();
  const isRunOfStudy = (runId: string) => {
    let known = runsInStudy.get(runId);
    if (!known) {
      known = getRunById({ id: runId }).then((found) => found?.studyId === studyId && found.teamId === teamId, () => false);
      runsInStudy.set(runId, known);
    }
    return known;
  };

  const announcePresence = () => publishLiveEvent({ kind: "presence", teamId, studyId, at: new Date().toISOString() });

  return openLiveStream({
    request,
    select: async (event: LiveEvent) => {
      if (event.teamId !== teamId) return null;
      if (event.kind === "presence") {
        if (event.studyId !== studyId) return null;
        const data: PresenceStreamMessage = { studyId, at: event.at };
        return { event: "presence", id: `presence-${event.at}`, data };
      }
      if (event.kind === "job") return event.studyId === studyId ? jobMessage(event) : null;
      const concernsStudy = event.studyId === studyId || (event.studyId === null && !!event.runId && (await isRunOfStudy(event.runId)));
      return concernsStudy ? activityMessage(event) : null;
    },
    recheckAfter: (event) => isMembershipChange(event, teamId),
    stillAllowed: async () => {
      // The same session or token as at the connect (a revoked or expired token throws: the stream ends).
      const session = await getCaller(request.headers);
      if (session?.userId !== caller.userId || session.token?.id !== caller.token?.id) return false;
      const role = await getCallerRole({ caller: session, teamId });
      return role !== null && roleAllows(role, "study:read");
    },
    onOpen: async () => {
      await joinStudyPresence({ id: presenceId, studyId, userId: caller.userId });
      await announcePresence();
    },
    onPing: () => touchStudyPresence({ id: presenceId }),
    onClose: async () => {
      await leaveStudyPresence({ id: presenceId });
      await announcePresence();
    },
  });
});
