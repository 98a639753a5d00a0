// The one server-side gate: every route handler and page asks here who is calling and whether
// their role in the owning team allows the action.
import "server-only";
import { getBlockById } from "@/db/queries/blocks";
import { getRunById } from "@/db/queries/runs";
import { getSceneById } from "@/db/queries/scenes";
import { getStudyById } from "@/db/queries/studies";
import type { BlockItem, RunRecord, SceneRecord, StudyRecord } from "@/lib/http/api-types";
import { getMembershipRole } from "@/db/queries/teams";
import { decideAccess } from "@/lib/access/decide";
import type { TeamAction, TeamRole } from "@/lib/access/roles";
import { AppError } from "@/lib/http/app-error";
import { getAuth } from "./auth";

export interface Caller {
  userId: string;
  name: string;
  email: string;
  activeTeamId: string | null;
}

export async function getCaller(headers: Headers): Promise<Caller | null> {
  const auth = await getAuth();
  const result = await auth.api.getSession({ headers });
  if (!result) return null;
  const activeTeamId = (result.session as { activeOrganizationId?: string | null }).activeOrganizationId ?? null;
  return { userId: result.user.id, name: result.user.name, email: result.user.email, activeTeamId };
}

export async function requireCaller(headers: Headers): Promise<Caller> {
  const caller = await getCaller(headers);
  if (!caller) throw new AppError("unauthorized:session", "Sign in to continue.");
  return caller;
}

function enforce(decision: ReturnType<typeof decideAccess>, subject: string, action: TeamAction): void {
  if (decision === "allow") return;
  if (decision === "unauthenticated") throw new AppError("unauthorized:session", "Sign in to continue.");
  if (decision === "not_found") throw new AppError(`not_found:${subject}`, `No such ${subject}.`);
  throw new AppError(`forbidden:${subject}`, `Your role in this team does not allow ${action.replace(":", " ")}.`);
}

export async function requireTeamAccess({ caller, teamId, action }: { caller: Caller; teamId: string; action: TeamAction }): Promise<{ role: TeamRole }> {
  const role = await getMembershipRole({ teamId, userId: caller.userId });
  enforce(decideAccess({ signedIn: true, role, action }), "team", action);
  return { role: role! };
}

export async function requireStudyAccess({
  caller,
  studyId,
  action,
}: {
  caller: Caller;
  studyId: string;
  action: TeamAction;
}): Promise<{ study: StudyRecord; role: TeamRole }> {
  const study = await getStudyById({ id: studyId });
  const role = study ? await getMembershipRole({ teamId: study.teamId, userId: caller.userId }) : null;
  enforce(decideAccess({ signedIn: true, role, action }), "study", action);
  return { study: study!, role: role! };
}

export async function requireSceneAccess({
  caller,
  sceneId,
  action,
}: {
  caller: Caller;
  sceneId: string;
  action: TeamAction;
}): Promise<{ scene: SceneRecord; role: TeamRole }> {
  const scene = await getSceneById({ id: sceneId });
  const role = scene ? await getMembershipRole({ teamId: scene.teamId, userId: caller.userId }) : null;
  enforce(decideAccess({ signedIn: true, role, action }), "scene", action);
  return { scene: scene!, role: role! };
}

export async function requireBlockAccess({
  caller,
  blockId,
  action,
}: {
  caller: Caller;
  blockId: string;
  action: TeamAction;
}): Promise<{ block: BlockItem & { studyId: string }; study: StudyRecord; role: TeamRole }> {
  const block = await getBlockById({ id: blockId });
  const study = block ? await getStudyById({ id: block.studyId }) : null;
  const role = study ? await getMembershipRole({ teamId: study.teamId, userId: caller.userId }) : null;
  enforce(decideAccess({ signedIn: true, role, action }), "block", action);
  return { block: block!, study: study!, role: role! };
}

export async function requireRunAccess({
  caller,
  runId,
  action,
}: {
  caller: Caller;
  runId: string;
  action: TeamAction;
}): Promise<{ run: RunRecord; role: TeamRole }> {
  const run = await getRunById({ id: runId });
  const role = run ? await getMembershipRole({ teamId: run.teamId, userId: caller.userId }) : null;
  enforce(decideAccess({ signedIn: true, role, action }), "run", action);
  return { run: run!, role: role! };
}
