// The one server-side gate: every route handler and page asks here who is calling and whether
// their role in the owning team allows the action. A caller is a signed-in session (cookie) or a
// script presenting a personal API token (Authorization: Bearer rft_…); a token reaches only its
// own team and acts with the lower of its role and its owner's current role there.
import "server-only";
import { findApiTokenBySecret, touchApiTokenLastUsed } from "@/db/queries/api-tokens";
import { getBlockById } from "@/db/queries/blocks";
import { getRunById } from "@/db/queries/runs";
import { getSceneById } from "@/db/queries/scenes";
import { getStudyById } from "@/db/queries/studies";
import type { BlockItem, RunRecord, SceneRecord, StudyRecord } from "@/lib/http/api-types";
import { getMembershipRole, listMembershipsByUserId } from "@/db/queries/teams";
import { decideAccess } from "@/lib/access/decide";
import type { TeamAction, TeamRole } from "@/lib/access/roles";
import { cappedTokenRole } from "@/lib/access/token-scope";
import { AppError } from "@/lib/http/app-error";
import { apiTokenSecretPattern } from "@/lib/validation/api-token";
import { getAuth } from "./auth";

/** The personal API token a script called with: the one team it reaches and the most it may do there. */
export interface CallerToken {
  id: string;
  teamId: string;
  role: TeamRole;
}

export interface Caller {
  userId: string;
  name: string;
  email: string;
  activeTeamId: string | null;
  /** Set when the call carried a bearer token instead of a session cookie. */
  token?: CallerToken;
}

const bearerPattern = /^Bearer[ \t]+(\S+)[ \t]*$/i;

function tokenRefused(message: string): AppError {
  return new AppError("unauthorized:token", message);
}

/**
 * The caller behind an Authorization header. Any failure is a 401 with the reason: a script that
 * sent a token wants to know why it was refused, and a call with a header never falls back to the
 * session cookie (a page's cookie must not lend its rights to a bad token, or the other way round).
 */
async function callerFromAuthorization(authorization: string, now = new Date()): Promise<Caller> {
  const match = bearerPattern.exec(authorization);
  if (!match) throw tokenRefused("Send a personal API token as \"Authorization: Bearer rft_…\"; no other scheme is accepted.");
  const secret = match[1]!;
  if (!apiTokenSecretPattern.test(secret)) throw tokenRefused("This is not a Rarefact API token: it starts with rft_ and has 47 characters. Copy it again from Settings, API tokens.");
  const token = await findApiTokenBySecret({ secret });
  if (!token) throw tokenRefused("This API token is not known. It may have been mistyped or deleted with its team; make a new one under Settings, API tokens.");
  if (token.revokedAt) throw tokenRefused(`This API token was revoked on ${token.revokedAt.toISOString()}; make a new one under Settings, API tokens.`);
  if (token.expiresAt && token.expiresAt.getTime() <= now.getTime()) throw tokenRefused(`This API token expired on ${token.expiresAt.toISOString()}; make a new one under Settings, API tokens.`);
  await touchApiTokenLastUsed({ id: token.id, lastUsedAt: token.lastUsedAt, now });
  return { userId: token.userId, name: token.userName, email: token.email, activeTeamId: token.teamId, token: { id: token.id, teamId: token.teamId, role: token.role } };
}

/** Null when nobody is signed in; throws 401 for a bearer token that is malformed, unknown, revoked or expired. */
export async function getCaller(headers: Headers): Promise<Caller | null> {
  const authorization = headers.get("authorization");
  if (authorization !== null) return callerFromAuthorization(authorization);
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

/**
 * A signed-in person, not a script: for what a token must never do (make tokens, accept an
 * invitation, leave a team), whatever its role.
 */
export async function requireSessionCaller(headers: Headers, refusal: string): Promise<Caller> {
  const caller = await requireCaller(headers);
  if (caller.token) throw new AppError("forbidden:token", refusal);
  return caller;
}

/**
 * The caller's role in a team, or null when they are not a member. A token reaches its own team only
 * (any other is "not a member", hence 404) and acts with the lower of its role and the owner's
 * current one, so a token never outlives a demotion or a removal.
 */
export async function getCallerRole({ caller, teamId }: { caller: Caller; teamId: string }): Promise<TeamRole | null> {
  if (caller.token && caller.token.teamId !== teamId) return null;
  const role = await getMembershipRole({ teamId, userId: caller.userId });
  if (role === null) return null;
  return caller.token ? cappedTokenRole(caller.token.role, role) : role;
}

/** The teams the caller reaches, with the role they act with there (a token: its own team only, capped). */
export async function listCallerMemberships(caller: Caller): Promise<Awaited<ReturnType<typeof listMembershipsByUserId>>> {
  const memberships = await listMembershipsByUserId({ userId: caller.userId });
  const token = caller.token;
  if (!token) return memberships;
  return memberships.filter((m) => m.teamId === token.teamId).map((m) => ({ ...m, role: cappedTokenRole(token.role, m.role) }));
}

function enforce(decision: ReturnType<typeof decideAccess>, subject: string, action: TeamAction, caller: Caller): void {
  if (decision === "allow") return;
  if (decision === "unauthenticated") throw new AppError("unauthorized:session", "Sign in to continue.");
  if (decision === "not_found") throw new AppError(`not_found:${subject}`, `No such ${subject}.`);
  const what = action.replace(":", " ");
  if (caller.token) throw new AppError(`forbidden:${subject}`, `This API token's role (${caller.token.role}, and never more than yours in the team) does not allow ${what}.`);
  throw new AppError(`forbidden:${subject}`, `Your role in this team does not allow ${what}.`);
}

export async function requireTeamAccess({ caller, teamId, action }: { caller: Caller; teamId: string; action: TeamAction }): Promise<{ role: TeamRole }> {
  const role = await getCallerRole({ caller, teamId });
  enforce(decideAccess({ signedIn: true, role, action }), "team", action, caller);
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
  const role = study ? await getCallerRole({ caller, teamId: study.teamId }) : null;
  enforce(decideAccess({ signedIn: true, role, action }), "study", action, caller);
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
  const role = scene ? await getCallerRole({ caller, teamId: scene.teamId }) : null;
  enforce(decideAccess({ signedIn: true, role, action }), "scene", action, caller);
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
  const role = study ? await getCallerRole({ caller, teamId: study.teamId }) : null;
  enforce(decideAccess({ signedIn: true, role, action }), "block", action, caller);
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
  const role = run ? await getCallerRole({ caller, teamId: run.teamId }) : null;
  enforce(decideAccess({ signedIn: true, role, action }), "run", action, caller);
  return { run: run!, role: role! };
}
