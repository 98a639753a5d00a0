// zod descriptions of the answers scripts rely on most, for the OpenAPI document only (the routes
// answer the TypeScript types in lib/http). Each is checked against its type at compile time, so the
// document cannot promise a field the answer lacks.
import "server-only";
import { z } from "zod";
import { teamRoles } from "@/lib/access/roles";
import type { ApiTokenItem } from "@/lib/http/api-token-types";
import type { SceneRecord, StudyRecord } from "@/lib/http/api-types";
import type { ErrorBody } from "@/lib/http/app-error";
import type { RunJobItem, SweepBatchItem } from "@/lib/http/job-types";

/** Fails to compile unless A and B are the same type. */
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
function sameShape<T>() {
  return <S extends z.ZodType>(schema: S & (Same<z.output<S>, T> extends true ? unknown : never)) => schema;
}

const isoTime = z.string().meta({ format: "date-time" });
const id = z.string().meta({ format: "uuid" });

export const errorBodySchema = sameShape<ErrorBody>()(
  z
    .object({
      error: z.object({
        code: z.custom<ErrorBody["error"]["code"]>((value) => typeof value === "string").meta({ type: "string", description: 'kind:subject, e.g. "forbidden:team", "bad_request:study"; the HTTP status follows from the kind.', example: "bad_request:study" }),
        message: z.string().meta({ description: "A sentence for people; a bad field is named first (\"title: Title needs at least 3 characters.\")." }),
        issues: z.array(z.object({ path: z.string(), message: z.string() })).optional().meta({ description: "One entry per bad field (400 only)." }),
      }),
    })
    .meta({ id: "Error" }),
);

const role = z.enum(teamRoles);

export const apiTokenItemSchema = sameShape<ApiTokenItem>()(
  z
    .object({
      id,
      name: z.string(),
      teamId: id,
      teamName: z.string(),
      role: role.meta({ description: "The most the token may do; its owner's current role in the team caps it at every call." }),
      prefix: z.string().meta({ description: "The secret's first characters, to tell tokens apart.", example: "rft_AbCd" }),
      createdAt: isoTime,
      lastUsedAt: isoTime.nullable().meta({ description: "Updated at most once a minute." }),
      expiresAt: isoTime.nullable(),
      revokedAt: isoTime.nullable(),
    })
    .meta({ id: "ApiToken" }),
);

export const studyRecordSchema = sameShape<StudyRecord>()(
  z.object({ id, teamId: id, title: z.string(), description: z.string(), siteReference: z.string(), createdAt: isoTime, updatedAt: isoTime }).meta({ id: "Study" }),
);

export const sceneRecordSchema = sameShape<SceneRecord>()(
  z
    .object({
      id,
      studyId: id,
      teamId: id,
      name: z.string(),
      description: z.string(),
      isReference: z.boolean(),
      version: z.number().int(),
      data: z.unknown().meta({ description: "The scene JSON (version, domain, resolution, medium, geometry, boundary, sources, receivers, duration, output)." }),
      forkedFromSceneId: id.nullable(),
      forkedFromVersion: z.number().int().nullable(),
      updatedByName: z.string().nullable(),
      createdAt: isoTime,
      updatedAt: isoTime,
    })
    .meta({ id: "Scene" }),
);

const jobState = z.enum(["queued", "running", "completed", "failed", "cancelled"]);
const person = z.object({ id, name: z.string() }).nullable();

export const runJobItemSchema = sameShape<RunJobItem>()(
  z
    .object({
      id,
      teamId: id,
      studyId: id,
      sceneId: id.nullable(),
      sceneName: z.string().nullable(),
      sceneVersion: z.number().int(),
      kind: z.enum(["run", "sweep-reference", "sweep-case"]),
      sweepId: id.nullable(),
      label: z.string(),
      state: jobState,
      position: z.number().int().nullable().meta({ description: "1-based place among all queued jobs; null unless queued." }),
      workerId: z.string().nullable(),
      attempt: z.number().int(),
      maxAttempts: z.number().int(),
      progress: z.number().meta({ description: "0..1 of the current attempt." }),
      cellUpdatesPerSecond: z.number().nullable(),
      secondsLeft: z.number().nullable(),
      cellSteps: z.number().meta({ description: "Grid cells x time steps." }),
      failures: z.array(z.object({ attempt: z.number().int(), workerId: z.string().nullable(), message: z.string(), at: isoTime })),
      message: z.string(),
      cancelRequested: z.boolean(),
      runId: id.nullable().meta({ description: "The saved run it produced, once completed (plain runs)." }),
      createdBy: person,
      createdAt: isoTime,
      startedAt: isoTime.nullable(),
      finishedAt: isoTime.nullable(),
    })
    .meta({ id: "RunJob" }),
);

export const sweepBatchItemSchema = sameShape<SweepBatchItem>()(
  z
    .object({
      id,
      studyId: id,
      sceneId: id.nullable(),
      sceneVersion: z.number().int(),
      label: z.string(),
      state: jobState,
      message: z.string(),
      caseCount: z.number().int(),
      referenceCount: z.number().int(),
      counts: z.record(jobState, z.number().int()),
      blockId: id.nullable().meta({ description: "The sweep chart block written into the notebook when it finished." }),
      createdBy: person,
      createdAt: isoTime,
      finishedAt: isoTime.nullable(),
    })
    .meta({ id: "SweepBatch" }),
);
