"use client";
// Server-side runs from the browser: the study's queue (jobs, server sweeps, the team's limits and the
// workers seen), queueing a saved scene version or a sweep, and cancelling either. Live job events
// (lib/client/use-live-updates.ts) keep the queue fresh; the timed refetch below is only a fallback.
import { useMutation, useQuery, useQueryClient, type QueryClient } from "@tanstack/react-query";
import type { RunJobItem, StudyQueueResponse, SweepBatchItem } from "@/lib/http/job-types";
import type { QueueRunRequest, QueueSweepRequest } from "@/lib/validation/jobs";
import { fetchJson } from "./api";

export const jobQueryKeys = {
  studyJobs: (studyId: string) => ["studies", studyId, "jobs"] as const,
  /** Under the study's jobs, so that the same live events refresh it. */
  sweep: (studyId: string, sweepId: string) => ["studies", studyId, "jobs", "sweep", sweepId] as const,
};

export interface QueuedRunAnswer {
  job: RunJobItem;
}

export interface SweepAnswer {
  sweep: SweepBatchItem;
  jobs: RunJobItem[];
}

/** While a job runs its progress moves every few seconds; live events say so, this catches a dropped stream. */
const runningRefetchMs = 5_000;
/** Queued jobs move up as other teams' jobs start, which sends this study no event: a slower look. */
const queuedRefetchMs = 15_000;

export function queueRefetchInterval(data: StudyQueueResponse | undefined): number | false {
  if (!data) return false;
  const states = [...data.jobs.map((job) => job.state), ...data.sweeps.map((sweep) => sweep.state)];
  if (states.includes("running")) return runningRefetchMs;
  if (states.includes("queued")) return queuedRefetchMs;
  return false;
}

export function useStudyJobs(studyId: string, options: { enabled?: boolean } = {}) {
  return useQuery({
    queryKey: jobQueryKeys.studyJobs(studyId),
    queryFn: () => fetchJson<StudyQueueResponse>(`/api/studies/${studyId}/jobs`),
    refetchInterval: (query) => queueRefetchInterval(query.state.data),
    enabled: options.enabled ?? true,
  });
}

/** One server sweep with its runs: the sweeps page follows it after a reload (`?sweep=<id>`). */
export function useServerSweep(studyId: string, sweepId: string | undefined) {
  return useQuery({
    queryKey: jobQueryKeys.sweep(studyId, sweepId ?? ""),
    queryFn: () => fetchJson<SweepAnswer>(`/api/sweeps/${sweepId}`),
    enabled: sweepId !== undefined,
  });
}

/** The queue and the study's own record and feed (which name the new job); not the notebook or the runs. */
function refreshStudyQueue(client: QueryClient, studyId: string) {
  return Promise.all([
    client.invalidateQueries({ queryKey: jobQueryKeys.studyJobs(studyId) }),
    client.invalidateQueries({ queryKey: ["studies", studyId], exact: true }),
    client.invalidateQueries({ queryKey: ["studies", studyId, "activity"] }),
  ]);
}

/** Queues a saved version of a scene (its latest when `sceneVersion` is left out). */
export function useQueueRun(sceneId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: QueueRunRequest) => fetchJson<QueuedRunAnswer>(`/api/scenes/${sceneId}/jobs`, { method: "POST", json: input }),
    onSuccess: (answer) => refreshStudyQueue(client, answer.job.studyId),
  });
}

/** Queues every planned run of a sweep definition; the server writes the chart block when the last one ends. */
export function useQueueSweep(sceneId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: QueueSweepRequest) => fetchJson<SweepAnswer>(`/api/scenes/${sceneId}/sweeps`, { method: "POST", json: input }),
    onSuccess: (answer) => refreshStudyQueue(client, answer.sweep.studyId),
  });
}

export function useCancelJob() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (jobId: string) => fetchJson<QueuedRunAnswer>(`/api/jobs/${jobId}/cancel`, { method: "POST" }),
    onSuccess: (answer) => refreshStudyQueue(client, answer.job.studyId),
  });
}

export function useCancelSweep() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (sweepId: string) => fetchJson<SweepAnswer>(`/api/sweeps/${sweepId}/cancel`, { method: "POST" }),
    onSuccess: (answer) => refreshStudyQueue(client, answer.sweep.studyId),
  });
}
