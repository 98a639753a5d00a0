// Server-side runs as the API answers them: a queued job (a plain run of a saved scene version, or
// one planned run of a server sweep), a server sweep, and the team's queue limits in use.

/** The same lists as the run_job table's columns in db/schema.ts. */
export type RunJobState = "queued" | "running" | "completed" | "failed" | "cancelled";
export type RunJobKind = "run" | "sweep-reference" | "sweep-case";

export interface RunJobFailure {
  attempt: number;
  workerId: string | null;
  message: string;
  at: string;
}

export interface RunJobItem {
  id: string;
  teamId: string;
  studyId: string;
  sceneId: string | null;
  sceneName: string | null;
  sceneVersion: number;
  kind: RunJobKind;
  sweepId: string | null;
  /** "Scene A v3", or the sweep case: "Barrier height = 3.5 m". */
  label: string;
  state: RunJobState;
  /** 1-based place among all queued jobs of every team (the order workers take them); null unless queued. */
  position: number | null;
  workerId: string | null;
  attempt: number;
  maxAttempts: number;
  /** 0..1 of the current attempt. */
  progress: number;
  cellUpdatesPerSecond: number | null;
  /** Estimated from progress and rate while running; null otherwise. */
  secondsLeft: number | null;
  /** Grid cells x time steps. */
  cellSteps: number;
  failures: RunJobFailure[];
  /** Why it failed or was cancelled, in words. */
  message: string;
  cancelRequested: boolean;
  /** The saved run it produced (plain runs). */
  runId: string | null;
  createdBy: { id: string; name: string } | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

export interface SweepBatchItem {
  id: string;
  studyId: string;
  sceneId: string | null;
  sceneVersion: number;
  label: string;
  state: RunJobState;
  message: string;
  caseCount: number;
  referenceCount: number;
  /** Jobs of the sweep by state. */
  counts: Record<RunJobState, number>;
  /** The sweep chart block written into the notebook when it finished. */
  blockId: string | null;
  createdBy: { id: string; name: string } | null;
  createdAt: string;
  finishedAt: string | null;
}

export interface QueueLimits {
  /** Most queued or running jobs a team may have at once. */
  maxActiveJobs: number;
  /** Largest job, cells x steps. */
  maxCellStepsPerJob: number;
  /** Most work, cells x steps, a team may have queued or running at once. */
  maxActiveCellSteps: number;
  activeJobs: number;
  /** Cells x steps of the team's queued and running jobs together. */
  activeCellSteps: number;
}

export interface StudyQueueResponse {
  jobs: RunJobItem[];
  sweeps: SweepBatchItem[];
  limits: QueueLimits;
  /** Worker processes seen in the last minute (id, host, jobs in hand). */
  workers: { id: string; lastSeenAt: string; runningJobs: number }[];
}
