// Every operation of Rarefact's HTTP API, with the same zod schemas the route handlers parse with.
// The OpenAPI document (document.ts) is built from this list, and tests/integration/openapi.test.ts
// fails when a route file exports a method that is missing here, or this list names a route that
// does not exist, so the document cannot drift from the code.
import "server-only";
import { z } from "zod";
import type { TeamAction } from "@/lib/access/roles";
import { feedPageQuerySchema } from "@/lib/validation/activity";
import { apiTokenCreateSchema } from "@/lib/validation/api-token";
import { bandLevelsQuerySchema } from "@/lib/validation/band-levels";
import { blockCreateSchema, blockOrderSchema, blockUpdateSchema } from "@/lib/validation/blocks";
import { commentEditSchema, commentResolutionSchema, newCommentSchema } from "@/lib/validation/comment";
import { forkRequestSchema } from "@/lib/validation/fork";
import { idSchema } from "@/lib/validation/ids";
import { jobListQuerySchema, queueRunSchema, queueSweepSchema } from "@/lib/validation/jobs";
import { reviewDecisionSchema } from "@/lib/validation/review";
import { sceneCreateSchema, sceneSaveSchema } from "@/lib/validation/scene-save";
import { sceneRestoreSchema, versionNumberSchema } from "@/lib/validation/scene-version";
import { shareLinkCreateSchema, shareTokenSchema } from "@/lib/validation/share-link";
import { studyInputSchema } from "@/lib/validation/study";
import { invitationInputSchema, invitationTokenSchema, roleChangeSchema } from "@/lib/validation/team";
import { runEvidenceAttachSchema, verificationRecordInputSchema } from "@/lib/validation/verification";
import { apiTokenItemSchema, runJobItemSchema, sceneRecordSchema, studyRecordSchema, sweepBatchItemSchema } from "./response-schemas";

export const apiTags = [
  { name: "Tokens", description: "Personal API tokens, made and revoked by a signed-in person (a token cannot manage tokens)." },
  { name: "Account", description: "Who is calling and what they reach." },
  { name: "Teams", description: "Teams, members, invitations, the kept e-mail and the team feed." },
  { name: "Studies", description: "Studies, their notebooks, feeds and read-only links." },
  { name: "Scenes", description: "Scenes and their saved versions, forks and lineage." },
  { name: "Run queue", description: "Runs and sweeps sent to the server's worker processes." },
  { name: "Runs", description: "Saved runs: results, band levels, review and quality evidence." },
  { name: "Comments", description: "Discussion threads on saved runs." },
  { name: "Verification", description: "Saved results of the solver's verification cases." },
  { name: "Live updates", description: "Server-sent event streams that tell open pages something changed." },
  { name: "Read-only links", description: "A study opened by its link, without signing in." },
  { name: "Reference", description: "This document." },
] as const;
export type ApiTag = (typeof apiTags)[number]["name"];

/**
 * Who may call: a team action (checked in the team that owns the thing, for sessions and tokens alike),
 * any signed-in caller, a signed-in person only (never a token), or anyone.
 */
export type OperationAccess = TeamAction | "signed-in" | "session-only" | "public";

export type ErrorStatus = 400 | 401 | 403 | 404 | 409 | 410 | 413;

export interface ApiOperation {
  method: "get" | "post" | "put" | "patch" | "delete";
  /** OpenAPI form: /api/studies/{studyId}. */
  path: string;
  operationId: string;
  summary: string;
  description?: string;
  tag: ApiTag;
  access: OperationAccess;
  /** Where the action is checked when it is not the path's own thing ("the job's study"). */
  accessNote?: string;
  params?: z.ZodObject;
  query?: z.ZodObject;
  body?: { schema: z.ZodType; description?: string; contentType?: "application/json" } | { contentType: "application/octet-stream"; description: string };
  success: { status: 200 | 201 | 202 | 204 | 304; description: string; schema?: z.ZodType; contentType?: "application/json" | "text/csv" | "text/event-stream" | "application/octet-stream" };
  /** Errors beyond those that follow from the rest (400 with input, 401 unless public, 403 for actions, 404 with path ids, 413 with a body). */
  errors?: { status: ErrorStatus; description: string }[];
}

/** A path id: the long UUID pattern zod emits says nothing "format: uuid" does not, and clutters the reference. */
const uuid = (description: string) =>
  idSchema.meta({
    description,
    override: ({ jsonSchema }) => {
      delete jsonSchema.pattern;
    },
  });
const studyParams = z.object({ studyId: uuid("The study's id.") });
const sceneParams = z.object({ sceneId: uuid("The scene's id.") });
const runParams = z.object({ runId: uuid("The saved run's id.") });
const teamParams = z.object({ teamId: uuid("The team's id.") });
const commentParams = z.object({ commentId: uuid("The comment's id.") });
const jobParams = z.object({ jobId: uuid("The queued job's id.") });
const sweepParams = z.object({ sweepId: uuid("The server sweep's id.") });
const versionParams = sceneParams.extend({ version: versionNumberSchema.meta({ description: "A saved version of the scene (1, 2, …).", type: "integer" }) });
const sharedParams = z.object({ token: shareTokenSchema.meta({ description: "The read-only link's secret (43 characters)." }) });
const invitationParams = z.object({ token: invitationTokenSchema.meta({ description: "The invitation link's secret (43 characters)." }) });

const json = (description: string, schema?: z.ZodType) => ({ status: 200 as const, description, schema });
const created = (description: string, schema?: z.ZodType) => ({ status: 201 as const, description, schema });
const staleVersion = { status: 409 as const, description: "The version you edited is no longer the latest: reload and apply your change again." };

export const apiOperations: ApiOperation[] = [
  // --- Tokens and account -------------------------------------------------------------------------
  {
    method: "get", path: "/api/me/tokens", operationId: "listApiTokens", tag: "Tokens", access: "session-only",
    summary: "List your API tokens", description: "Newest first, revoked and expired ones included. Secrets are never listed.",
    success: json("Your tokens.", z.object({ tokens: z.array(apiTokenItemSchema) })),
  },
  {
    method: "post", path: "/api/me/tokens", operationId: "createApiToken", tag: "Tokens", access: "session-only",
    summary: "Make an API token",
    description: "Scoped to one team and a role within yours there (403 otherwise; 404 when you are not on the team). The secret `rft_…` is in this answer only; store it like a password. Leave out `expiresInDays` for a token that does not expire.",
    body: { schema: apiTokenCreateSchema },
    success: created("The token and its secret, shown once.", z.object({ token: apiTokenItemSchema, secret: z.string().meta({ description: "rft_ and 43 base64url characters." }) })),
  },
  {
    method: "delete", path: "/api/me/tokens/{tokenId}", operationId: "revokeApiToken", tag: "Tokens", access: "session-only",
    summary: "Revoke an API token", description: "From this answer on, calls with it get 401. Revoking twice changes nothing.",
    params: z.object({ tokenId: uuid("The token's id (not its secret).") }),
    success: json("The revoked token.", z.object({ token: apiTokenItemSchema })),
  },
  {
    method: "get", path: "/api/me", operationId: "getMe", tag: "Account", access: "signed-in",
    summary: "Who is calling", description: "The user, their teams with their roles and the active team. With a token: its one team and the role it acts with.",
    success: json("The caller."),
  },
  {
    method: "get", path: "/api/me/fork-targets", operationId: "listForkTargets", tag: "Account", access: "signed-in",
    summary: "Studies a fork may go to", description: "Every study, over the teams the caller reaches, where their role edits scenes.",
    success: json("`{ targets: [{ studyId, studyTitle, teamId, teamName }] }`"),
  },
  // --- Teams -----------------------------------------------------------------------------------------
  {
    method: "get", path: "/api/teams/{teamId}/studies", operationId: "listStudies", tag: "Teams", access: "study:read",
    summary: "List a team's studies", params: teamParams, success: json("The team's studies.", z.object({ studies: z.array(z.unknown()) })),
  },
  {
    method: "post", path: "/api/teams/{teamId}/studies", operationId: "createStudy", tag: "Teams", access: "study:create",
    summary: "Create a study", params: teamParams, body: { schema: studyInputSchema }, success: created("The new study.", z.object({ study: studyRecordSchema })),
  },
  {
    method: "get", path: "/api/teams/{teamId}/members", operationId: "listMembers", tag: "Teams", access: "team:read",
    summary: "List a team's members", params: teamParams, success: json("The team and its members with roles."),
  },
  {
    method: "patch", path: "/api/teams/{teamId}/members/{memberId}", operationId: "changeMemberRole", tag: "Teams", access: "team:manage-members",
    summary: "Change a member's role", params: teamParams.extend({ memberId: uuid("The member's user id.") }), body: { schema: roleChangeSchema },
    success: json("The member."), errors: [{ status: 409, description: "The team would be left without an owner." }],
  },
  {
    method: "delete", path: "/api/teams/{teamId}/members/{memberId}", operationId: "removeMember", tag: "Teams", access: "team:manage-members",
    summary: "Remove a member, or leave", description: "Owners remove anyone; anyone removes themselves (leaves) — but only signed in, never with a token.",
    params: teamParams.extend({ memberId: uuid("The member's user id.") }),
    success: json("The removed member."), errors: [{ status: 409, description: "The team would be left without an owner." }],
  },
  {
    method: "get", path: "/api/teams/{teamId}/invitations", operationId: "listInvitations", tag: "Teams", access: "team:manage-members",
    summary: "List a team's invitations", params: teamParams, success: json("Invitations with their state (pending, expired, accepted, revoked)."),
  },
  {
    method: "post", path: "/api/teams/{teamId}/invitations", operationId: "inviteMember", tag: "Teams", access: "team:manage-members",
    summary: "Invite someone by e-mail", description: "The link travels only in the e-mail.", params: teamParams, body: { schema: invitationInputSchema },
    success: created("The invitation and whether its e-mail went out."), errors: [{ status: 409, description: "The address is on the team or has a pending invitation." }],
  },
  {
    method: "delete", path: "/api/teams/{teamId}/invitations/{invitationId}", operationId: "revokeInvitation", tag: "Teams", access: "team:manage-members",
    summary: "Withdraw an invitation", params: teamParams.extend({ invitationId: uuid("The invitation's id.") }), success: json("The withdrawn invitation."),
  },
  {
    method: "get", path: "/api/teams/{teamId}/mail", operationId: "listTeamMail", tag: "Teams", access: "team:read-mail",
    summary: "Read the team's kept e-mail", params: teamParams, success: json("Every message the app kept for the team."),
  },
  {
    method: "get", path: "/api/teams/{teamId}/activity", operationId: "listTeamActivity", tag: "Teams", access: "team:read",
    summary: "A page of the team's activity feed", params: teamParams, query: feedPageQuerySchema, success: json("`{ items, nextBefore }`, newest first."),
  },
  {
    method: "get", path: "/api/invitations/{token}", operationId: "describeInvitation", tag: "Teams", access: "public",
    summary: "What an invitation link offers", params: invitationParams, success: json("Team, role, inviter and expiry."),
    errors: [{ status: 404, description: "Unknown, used or withdrawn link." }, { status: 410, description: "The link has expired." }],
  },
  {
    method: "post", path: "/api/invitations/{token}/accept", operationId: "acceptInvitation", tag: "Teams", access: "session-only",
    summary: "Accept an invitation", description: "Signed in with the invited address.", params: invitationParams,
    success: json("The team joined and the role."), errors: [{ status: 409, description: "The link was used already." }, { status: 410, description: "The link has expired." }],
  },
  // --- Studies ---------------------------------------------------------------------------------------
  {
    method: "get", path: "/api/studies/{studyId}", operationId: "getStudy", tag: "Studies", access: "study:read",
    summary: "A study with its scenes and recent activity", params: studyParams, success: json("`{ study, role, scenes, activity }`"),
  },
  {
    method: "get", path: "/api/studies/{studyId}/activity", operationId: "listStudyActivity", tag: "Studies", access: "study:read",
    summary: "A page of the study's activity feed", params: studyParams, query: feedPageQuerySchema, success: json("`{ items, nextBefore }`, newest first."),
  },
  {
    method: "get", path: "/api/studies/{studyId}/blocks", operationId: "listBlocks", tag: "Studies", access: "study:read",
    summary: "The study's notebook blocks, in order", params: studyParams, success: json("`{ blocks }`"),
  },
  {
    method: "post", path: "/api/studies/{studyId}/blocks", operationId: "addBlock", tag: "Studies", access: "study:edit",
    summary: "Add a notebook block", description: "A run already in the notebook answers its existing block (200).", params: studyParams, body: { schema: blockCreateSchema },
    success: created("The new block."),
  },
  {
    method: "put", path: "/api/studies/{studyId}/blocks/order", operationId: "reorderBlocks", tag: "Studies", access: "study:edit",
    summary: "Reorder the notebook", params: studyParams, body: { schema: blockOrderSchema }, success: json("The blocks in their new order."),
  },
  {
    method: "get", path: "/api/studies/{studyId}/presence", operationId: "listPresence", tag: "Studies", access: "study:read",
    summary: "Who has the study open", params: studyParams, success: json("People seen in the last 60 s."),
  },
  {
    method: "get", path: "/api/studies/{studyId}/runs", operationId: "listRuns", tag: "Studies", access: "study:read",
    summary: "The study's saved runs with their key figures", params: studyParams, success: json("`{ runs }`, newest first."),
  },
  {
    method: "post", path: "/api/studies/{studyId}/scenes", operationId: "createScene", tag: "Scenes", access: "scene:edit",
    summary: "Add a scene from scene JSON or a template",
    description: "Give either `data` (the scene JSON; checked like a save, with errors naming the path under `data`) or a `templateId`.",
    params: studyParams, body: { schema: sceneCreateSchema }, success: created("The new scene, version 1.", z.object({ scene: sceneRecordSchema })),
  },
  {
    method: "get", path: "/api/studies/{studyId}/share-links", operationId: "listShareLinks", tag: "Studies", access: "study:share",
    summary: "The study's read-only links", params: studyParams, success: json("`{ links }`, revoked ones included."),
  },
  {
    method: "post", path: "/api/studies/{studyId}/share-links", operationId: "createShareLink", tag: "Studies", access: "study:share",
    summary: "Make a read-only link", params: studyParams, body: { schema: shareLinkCreateSchema }, success: created("The link and its URL, shown once."),
  },
  {
    method: "delete", path: "/api/studies/{studyId}/share-links/{linkId}", operationId: "revokeShareLink", tag: "Studies", access: "study:share",
    summary: "Revoke a read-only link", params: studyParams.extend({ linkId: uuid("The link's id.") }), success: json("The revoked link."),
  },
  {
    method: "get", path: "/api/studies/{studyId}/jobs", operationId: "listStudyJobs", tag: "Run queue", access: "study:read",
    summary: "The study's run queue", params: studyParams, query: jobListQuerySchema, success: json("Jobs, sweeps, the team's limits and the workers seen."),
  },
  // --- Blocks ----------------------------------------------------------------------------------------
  {
    method: "patch", path: "/api/blocks/{blockId}", operationId: "updateBlock", tag: "Studies", access: "study:edit",
    summary: "Edit or collapse a notebook block", params: z.object({ blockId: uuid("The block's id.") }), body: { schema: blockUpdateSchema },
    success: json("The block."), errors: [staleVersion],
  },
  {
    method: "delete", path: "/api/blocks/{blockId}", operationId: "deleteBlock", tag: "Studies", access: "study:edit",
    summary: "Remove a notebook block", params: z.object({ blockId: uuid("The block's id.") }), success: { status: 204, description: "Removed." },
  },
  // --- Scenes ----------------------------------------------------------------------------------------
  {
    method: "get", path: "/api/scenes/{sceneId}", operationId: "getScene", tag: "Scenes", access: "study:read",
    summary: "A scene, latest version", params: sceneParams, success: json("`{ scene, role }`", z.object({ scene: sceneRecordSchema, role: z.string() })),
  },
  {
    method: "put", path: "/api/scenes/{sceneId}", operationId: "saveScene", tag: "Scenes", access: "scene:edit",
    summary: "Save a new version of a scene", params: sceneParams, body: { schema: sceneSaveSchema }, success: json("The scene.", z.object({ scene: sceneRecordSchema })), errors: [staleVersion],
  },
  {
    method: "post", path: "/api/scenes/{sceneId}/fork", operationId: "forkScene", tag: "Scenes", access: "study:read",
    accessNote: "study:read on the origin; scene:edit in the target study", summary: "Fork a scene", params: sceneParams, body: { schema: forkRequestSchema },
    success: created("The fork.", z.object({ scene: sceneRecordSchema })),
  },
  {
    method: "get", path: "/api/scenes/{sceneId}/lineage", operationId: "getSceneLineage", tag: "Scenes", access: "study:read",
    summary: "Where a scene was forked from, and its forks", params: sceneParams, success: json("Origins up, forks down three levels; scenes elsewhere only as `{ access: \"other-team\" }`."),
  },
  {
    method: "get", path: "/api/scenes/{sceneId}/versions", operationId: "listSceneVersions", tag: "Scenes", access: "study:read",
    summary: "A scene's saved versions", params: sceneParams, success: json("`{ versions }`, newest first."),
  },
  {
    method: "get", path: "/api/scenes/{sceneId}/versions/{version}", operationId: "getSceneVersion", tag: "Scenes", access: "study:read",
    summary: "The scene JSON of one version", params: versionParams, success: json("`{ version, data }`"),
  },
  {
    method: "post", path: "/api/scenes/{sceneId}/versions/{version}/restore", operationId: "restoreSceneVersion", tag: "Scenes", access: "scene:edit",
    summary: "Restore an older version as the latest", params: versionParams, body: { schema: sceneRestoreSchema }, success: created("The scene.", z.object({ scene: sceneRecordSchema })), errors: [staleVersion],
  },
  {
    method: "post", path: "/api/scenes/{sceneId}/runs", operationId: "saveBrowserRun", tag: "Runs", access: "run:create",
    summary: "Save a run made in the browser",
    params: sceneParams,
    body: { contentType: "application/octet-stream", description: "The run's binary payload (RFRN format, lib/run-record/payload.ts), at most RAREFACT_MAX_RUN_UPLOAD_BYTES (64 MiB by default)." },
    success: created("The saved run."),
  },
  // --- Run queue -------------------------------------------------------------------------------------
  {
    method: "post", path: "/api/scenes/{sceneId}/jobs", operationId: "queueRun", tag: "Run queue", access: "run:create",
    summary: "Queue a run of a saved scene version on the server", params: sceneParams, body: { schema: queueRunSchema },
    success: { status: 202, description: "The queued job. Poll GET /api/jobs/{jobId} until its state is completed (then `runId` names the saved run), failed or cancelled.", schema: z.object({ job: runJobItemSchema }) },
    errors: [{ status: 409, description: "The team has as many active jobs as its limit allows (limit:queue)." }],
  },
  {
    method: "post", path: "/api/scenes/{sceneId}/sweeps", operationId: "queueSweep", tag: "Run queue", access: "run:create",
    summary: "Queue a parameter sweep on the server", description: "`definition.sceneId` must be the scene in the path.", params: sceneParams, body: { schema: queueSweepSchema },
    success: { status: 202, description: "The sweep and its jobs.", schema: z.object({ sweep: sweepBatchItemSchema, jobs: z.array(runJobItemSchema) }) },
    errors: [{ status: 409, description: "The team's active-job limit would be exceeded." }],
  },
  {
    method: "get", path: "/api/jobs/{jobId}", operationId: "getJob", tag: "Run queue", access: "study:read", accessNote: "in the job's study",
    summary: "One queued job", params: jobParams, success: json("The job.", z.object({ job: runJobItemSchema })),
  },
  {
    method: "post", path: "/api/jobs/{jobId}/cancel", operationId: "cancelJob", tag: "Run queue", access: "run:create", accessNote: "in the job's team",
    summary: "Cancel a queued or running job", params: jobParams, success: json("The job.", z.object({ job: runJobItemSchema })),
    errors: [{ status: 409, description: "The job has already finished." }],
  },
  {
    method: "get", path: "/api/sweeps/{sweepId}", operationId: "getSweep", tag: "Run queue", access: "study:read", accessNote: "in the sweep's study",
    summary: "One server sweep with its jobs", params: sweepParams, success: json("The sweep and its jobs.", z.object({ sweep: sweepBatchItemSchema, jobs: z.array(runJobItemSchema) })),
  },
  {
    method: "post", path: "/api/sweeps/{sweepId}/cancel", operationId: "cancelSweep", tag: "Run queue", access: "run:create", accessNote: "in the sweep's team",
    summary: "Cancel a sweep's unfinished jobs", params: sweepParams, success: json("The sweep and its jobs.", z.object({ sweep: sweepBatchItemSchema, jobs: z.array(runJobItemSchema) })),
  },
  // --- Runs ------------------------------------------------------------------------------------------
  {
    method: "get", path: "/api/runs/{runId}", operationId: "getRun", tag: "Runs", access: "study:read",
    summary: "A saved run's metadata and summary", params: runParams, success: json("`{ run, role }`"),
  },
  {
    method: "delete", path: "/api/runs/{runId}", operationId: "deleteRun", tag: "Runs", access: "run:create",
    summary: "Delete a saved run", description: "An owner, or the editor who saved it.", params: runParams, success: { status: 204, description: "Deleted." },
  },
  {
    method: "get", path: "/api/runs/{runId}/result", operationId: "getRunResult", tag: "Runs", access: "study:read",
    summary: "A saved run's binary payload", params: runParams,
    success: { status: 200, description: "The RFRN payload as stored (cached privately; revalidate with If-None-Match).", contentType: "application/octet-stream" },
  },
  {
    method: "get", path: "/api/runs/{runId}/band-levels.csv", operationId: "getRunBandLevelsCsv", tag: "Runs", access: "study:read",
    summary: "A saved run's band levels as CSV",
    description: "One row per receiver: the overall level and one column per octave or one-third-octave band the grid resolves (IEC 61260-1 bands; A weighting per IEC 61672-1), dB re 20 µPa, two decimals. The same figures as the run page's band-level panel. A 2D prediction, not a statutory noise assessment.",
    params: runParams, query: bandLevelsQuerySchema,
    success: { status: 200, description: "The table.", contentType: "text/csv" },
    errors: [{ status: 409, description: "The run has no receivers, or its scene cannot be read." }],
  },
  {
    method: "get", path: "/api/runs/{runId}/comments", operationId: "listComments", tag: "Comments", access: "study:read",
    summary: "A run's discussion threads", params: runParams, success: json("`{ threads }`"),
  },
  {
    method: "post", path: "/api/runs/{runId}/comments", operationId: "addComment", tag: "Comments", access: "run:comment",
    summary: "Start a thread or reply", params: runParams, body: { schema: newCommentSchema }, success: created("The comment."),
  },
  {
    method: "post", path: "/api/runs/{runId}/review", operationId: "decideReview", tag: "Runs", access: "study:read",
    accessNote: "then the review rules: run:request-review to ask, run:review to decide; nobody signs off their own run",
    summary: "Move a run's review state", params: runParams, body: { schema: reviewDecisionSchema }, success: created("The run and the review entry."),
    errors: [{ status: 409, description: "The review state changed meanwhile, or the run cannot be reviewed." }],
  },
  {
    method: "get", path: "/api/runs/{runId}/reviews", operationId: "listReviews", tag: "Runs", access: "study:read",
    summary: "A run's review history", params: runParams, success: json("`{ reviews }`, newest first."),
  },
  {
    method: "get", path: "/api/runs/{runId}/verifications", operationId: "listRunEvidence", tag: "Verification", access: "study:read",
    summary: "Verification records attached to a run", params: runParams, success: json("`{ evidence }`"),
  },
  {
    method: "post", path: "/api/runs/{runId}/verifications", operationId: "attachRunEvidence", tag: "Verification", access: "run:attach-evidence",
    summary: "Attach a verification record to a run", params: runParams, body: { schema: runEvidenceAttachSchema }, success: created("`{ evidence }` (200 when it was attached already)."),
  },
  {
    method: "delete", path: "/api/runs/{runId}/verifications/{verificationId}", operationId: "detachRunEvidence", tag: "Verification", access: "run:attach-evidence",
    summary: "Detach a verification record from a run", params: runParams.extend({ verificationId: uuid("The verification record's id.") }), success: json("`{ evidence }`"),
  },
  // --- Comments --------------------------------------------------------------------------------------
  {
    method: "get", path: "/api/comments/{commentId}", operationId: "getComment", tag: "Comments", access: "study:read",
    summary: "One comment", params: commentParams, success: json("`{ comment }`"),
  },
  {
    method: "patch", path: "/api/comments/{commentId}", operationId: "editComment", tag: "Comments", access: "study:read",
    accessNote: "its author only; with a token, run:comment too", summary: "Edit your comment", params: commentParams, body: { schema: commentEditSchema },
    success: json("`{ comment }`"), errors: [{ status: 409, description: "The comment has been deleted." }],
  },
  {
    method: "delete", path: "/api/comments/{commentId}", operationId: "deleteComment", tag: "Comments", access: "study:read",
    accessNote: "its author, or comment:moderate; with a token, run:comment too", summary: "Delete a comment", params: commentParams,
    success: { status: 204, description: "Deleted (the comment keeps its place for its replies)." }, errors: [{ status: 409, description: "Deleted already." }],
  },
  {
    method: "post", path: "/api/comments/{commentId}/resolution", operationId: "resolveThread", tag: "Comments", access: "run:comment",
    summary: "Resolve or reopen a thread", params: commentParams, body: { schema: commentResolutionSchema }, success: json("`{ comment }`"),
  },
  // --- Verification ----------------------------------------------------------------------------------
  {
    method: "get", path: "/api/teams/{teamId}/verifications", operationId: "listVerifications", tag: "Verification", access: "team:read",
    summary: "The team's saved verification results", params: teamParams, success: json("The records, newest first."),
  },
  {
    method: "post", path: "/api/teams/{teamId}/verifications", operationId: "saveVerification", tag: "Verification", access: "verification:record",
    summary: "Save verification results", params: teamParams, body: { schema: verificationRecordInputSchema }, success: created("`{ record }`"),
  },
  {
    method: "get", path: "/api/verifications/{verificationId}", operationId: "getVerification", tag: "Verification", access: "team:read", accessNote: "in the record's team",
    summary: "One verification record with its checks and curves", params: z.object({ verificationId: uuid("The record's id.") }), success: json("`{ record }`"),
  },
  // --- Live updates ----------------------------------------------------------------------------------
  {
    method: "get", path: "/api/studies/{studyId}/events", operationId: "streamStudyEvents", tag: "Live updates", access: "study:read",
    summary: "Live events of a study", description: "`event: activity`, `event: presence` and job events; `event: closed` when access is lost (a revoked token ends the stream at the next check).",
    params: studyParams, success: { status: 200, description: "A server-sent event stream.", contentType: "text/event-stream" },
  },
  {
    method: "get", path: "/api/teams/{teamId}/events", operationId: "streamTeamEvents", tag: "Live updates", access: "team:read",
    summary: "Live events of a team", params: teamParams, success: { status: 200, description: "A server-sent event stream.", contentType: "text/event-stream" },
  },
  // --- Read-only links -------------------------------------------------------------------------------
  {
    method: "get", path: "/api/shared/{token}", operationId: "getSharedStudy", tag: "Read-only links", access: "public",
    summary: "A study opened by its read-only link", params: sharedParams, success: json("Heading, notebook, scenes and saved runs."),
  },
  {
    method: "get", path: "/api/shared/{token}/runs/{runId}/result", operationId: "getSharedRunResult", tag: "Read-only links", access: "public",
    summary: "A saved run's payload through a read-only link", params: sharedParams.extend({ runId: uuid("A saved run of the shared study.") }),
    success: { status: 200, description: "The RFRN payload.", contentType: "application/octet-stream" },
  },
  // --- Reference -------------------------------------------------------------------------------------
  {
    method: "get", path: "/api/openapi.json", operationId: "getOpenApiDocument", tag: "Reference", access: "public",
    summary: "This OpenAPI document", success: json("OpenAPI 3.1."),
  },
];
