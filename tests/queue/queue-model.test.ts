// The study queue panel's pure model: ordering, progress of jobs and sweeps, and the words it shows.
import { describe, expect, it } from "vitest";
import { isActiveState, queueEntries } from "@/components/queue/model/queue-entries";
import { countByState, jobFraction, percentOf, sweepDisplayState, sweepProgress } from "@/components/queue/model/queue-progress";
import { attemptWords, jobStatusWords, limitUseWords, positionWords, refusalWords, sweepCountWords, timeLeftWords, workersWords } from "@/components/queue/model/queue-words";
import { queueRefetchInterval } from "@/lib/client/job-queries";
import type { RunJobItem, SweepBatchItem } from "@/lib/http/job-types";

function makeJob(overrides: Partial<RunJobItem> = {}): RunJobItem {
  return {
    id: "job-1",
    teamId: "team-1",
    studyId: "study-1",
    sceneId: "scene-1",
    sceneName: "Barrier",
    sceneVersion: 3,
    kind: "run",
    sweepId: null,
    label: "Barrier v3",
    state: "queued",
    position: 1,
    workerId: null,
    attempt: 0,
    maxAttempts: 3,
    progress: 0,
    cellUpdatesPerSecond: null,
    secondsLeft: null,
    cellSteps: 1e9,
    failures: [],
    message: "",
    cancelRequested: false,
    runId: null,
    createdBy: { id: "user-1", name: "Ana" },
    createdAt: "2025-03-01T10:00:00.000Z",
    startedAt: null,
    finishedAt: null,
    ...overrides,
  };
}

function makeSweep(overrides: Partial<SweepBatchItem> = {}): SweepBatchItem {
  return {
    id: "sweep-1",
    studyId: "study-1",
    sceneId: "scene-1",
    sceneVersion: 3,
    label: "Barrier height, 2 to 4 m",
    state: "running",
    message: "",
    caseCount: 2,
    referenceCount: 1,
    counts: { queued: 0, running: 0, completed: 0, failed: 0, cancelled: 0 },
    blockId: null,
    createdBy: { id: "user-1", name: "Ana" },
    createdAt: "2025-03-01T11:00:00.000Z",
    finishedAt: null,
    ...overrides,
  };
}

describe("queue entries", () => {
  it("lists plain runs and sweeps newest first, each sweep holding its own jobs in the server's order", () => {
    const older = makeJob({ id: "a", createdAt: "2025-03-01T09:00:00.000Z" });
    const newer = makeJob({ id: "b", createdAt: "2025-03-01T12:00:00.000Z" });
    const reference = makeJob({ id: "r", kind: "sweep-reference", sweepId: "sweep-1", createdAt: "2025-03-01T11:00:00.000Z" });
    const firstCase = makeJob({ id: "c1", kind: "sweep-case", sweepId: "sweep-1", createdAt: "2025-03-01T11:00:00.000Z" });
    const entries = queueEntries({ jobs: [older, firstCase, newer, reference], sweeps: [makeSweep()] });
    expect(entries.map((entry) => entry.id)).toEqual(["b", "sweep-1", "a"]);
    const sweep = entries[1];
    expect(sweep?.kind === "sweep" ? sweep.jobs.map((job) => job.id) : null).toEqual(["c1", "r"]);
  });

  it("keeps a sweep job whose sweep is missing from the answer as an entry of its own", () => {
    const orphan = makeJob({ id: "c9", kind: "sweep-case", sweepId: "gone" });
    expect(queueEntries({ jobs: [orphan], sweeps: [] }).map((entry) => entry.kind)).toEqual(["job"]);
  });

  it("orders entries of the same time by id, so refetches do not reshuffle them", () => {
    const at = "2025-03-01T10:00:00.000Z";
    const ids = queueEntries({ jobs: [makeJob({ id: "m", createdAt: at }), makeJob({ id: "z", createdAt: at }), makeJob({ id: "a", createdAt: at })], sweeps: [] }).map((e) => e.id);
    expect(ids).toEqual(["z", "m", "a"]);
  });

  it("counts only queued and running as active", () => {
    expect((["queued", "running", "completed", "failed", "cancelled"] as const).filter(isActiveState)).toEqual(["queued", "running"]);
  });
});

describe("progress", () => {
  it("counts jobs by state", () => {
    const counts = countByState([makeJob({ state: "running" }), makeJob({ state: "failed" }), makeJob({ state: "failed" })]);
    expect(counts).toEqual({ queued: 0, running: 1, completed: 0, failed: 2, cancelled: 0 });
  });

  it("counts a running job by its progress and a finished one whole", () => {
    expect(jobFraction(makeJob({ state: "running", progress: 0.25 }))).toBe(0.25);
    expect(jobFraction(makeJob({ state: "completed", progress: 0.4 }))).toBe(1);
    expect(jobFraction(makeJob({ state: "failed", progress: 0.9 }))).toBe(0);
  });

  it("never shows 100 % before a job has completed", () => {
    expect(percentOf(0.999, false)).toBe(99);
    // The last progress report says 1 while the result is still being stored.
    expect(percentOf(1, false)).toBe(99);
    expect(percentOf(0.999, true)).toBe(100);
    expect(percentOf(0.426, false)).toBe(42);
  });

  it("says how many cases of a sweep are done, weights its fraction by run size and estimates the time left from running rates", () => {
    const jobs = [
      makeJob({ id: "r", kind: "sweep-reference", sweepId: "sweep-1", state: "completed", cellSteps: 2e9, progress: 1 }),
      makeJob({ id: "c1", kind: "sweep-case", sweepId: "sweep-1", state: "running", cellSteps: 1e9, progress: 0.5, cellUpdatesPerSecond: 1e8 }),
      makeJob({ id: "c2", kind: "sweep-case", sweepId: "sweep-1", state: "failed", cellSteps: 1e9 }),
    ];
    const progress = sweepProgress(makeSweep(), jobs);
    expect(progress).toMatchObject({ caseCount: 2, casesDone: 0, referencesDone: 1, failed: 1, running: 1 });
    // (2e9 + 0.5e9) of 4e9 cell updates done.
    expect(progress.fraction).toBeCloseTo(0.625, 12);
    // 0.5e9 left of the running case at 1e8 per second; the failed case is not waited for.
    expect(progress.secondsLeft).toBeCloseTo(5, 12);
    expect(sweepCountWords(progress)).toBe("0 of 2 cases done, reference done, 1 running, 1 failed");
  });

  it("shows a queued sweep as running once one of its runs steps", () => {
    expect(sweepDisplayState({ state: "queued" }, { running: 1 })).toBe("running");
    expect(sweepDisplayState({ state: "queued" }, { running: 0 })).toBe("queued");
    expect(sweepDisplayState({ state: "cancelled" }, { running: 1 })).toBe("cancelled");
  });

  it("falls back on the sweep's own counts when its jobs are not in the answer", () => {
    const progress = sweepProgress(makeSweep({ counts: { queued: 0, running: 0, completed: 2, failed: 1, cancelled: 0 } }), []);
    expect(progress).toMatchObject({ casesDone: 1, referencesDone: 1, failed: 1, secondsLeft: null });
    expect(progress.fraction).toBeCloseTo(2 / 3, 12);
  });
});

describe("words", () => {
  it("words the time left, and says so when there is no estimate yet", () => {
    expect(timeLeftWords(null)).toBe("time left not known yet");
    expect(timeLeftWords(42)).toBe("about 42 s left");
    expect(timeLeftWords(600)).toBe("about 10 min left");
  });

  it("words the place in the queue", () => {
    expect(positionWords(1)).toBe("next in the queue");
    expect(positionWords(2)).toBe("2nd in the queue");
    expect(positionWords(13)).toBe("13th in the queue");
    expect(positionWords(23)).toBe("23rd in the queue");
    expect(positionWords(null)).toBe("waiting for a worker");
  });

  it("words the attempt, and a job's status by state", () => {
    expect(attemptWords({ attempt: 2, maxAttempts: 3 })).toBe("attempt 2 of 3");
    expect(attemptWords({ attempt: 0, maxAttempts: 3 })).toBeNull();
    expect(jobStatusWords(makeJob({ state: "running", workerId: "host-a:41" }))).toBe("on worker host-a:41");
    expect(jobStatusWords(makeJob({ state: "running", cancelRequested: true }))).toBe("cancelling…");
    expect(jobStatusWords(makeJob({ state: "failed", message: "The simulation became unstable." }))).toBe("The simulation became unstable.");
  });

  it("says the team's limit use, and when the queue is full", () => {
    const limits = { maxActiveJobs: 60, maxCellStepsPerJob: 2e11, maxActiveCellSteps: 2e12, activeCellSteps: 0 };
    expect(limitUseWords({ ...limits, activeJobs: 0 })).toBe("Your team has 0 of 60 jobs in the queue");
    expect(limitUseWords({ ...limits, activeJobs: 14, activeCellSteps: 2.4e11 })).toBe("Your team has 14 of 60 jobs in the queue, 12% of its work allowance");
    expect(limitUseWords({ ...limits, activeJobs: 1, activeCellSteps: 1e9 })).toBe("Your team has 1 of 60 jobs in the queue, under 1% of its work allowance");
    expect(limitUseWords({ ...limits, activeJobs: 60 })).toContain("full");
    expect(limitUseWords({ ...limits, activeJobs: 3, activeCellSteps: 2e12 })).toContain("full");
  });

  it("says which workers were seen", () => {
    expect(workersWords([])).toContain("No worker");
    expect(workersWords([{ id: "a", lastSeenAt: "", runningJobs: 1 }, { id: "b", lastSeenAt: "", runningJobs: 2 }])).toBe("2 workers seen in the last minute, 3 runs in hand.");
  });

  it("words the server's refusals: the queue limit, and the fields a bad request names", () => {
    expect(refusalWords({ status: 409, code: "limit:queue", message: "60 of 60 jobs are queued or running.", issues: [] })).toBe("The team's queue is full. 60 of 60 jobs are queued or running.");
    const tooLarge = refusalWords({ status: 400, code: "bad_request:job", message: "The run is too large.", issues: [{ path: "sceneVersion", message: "3.1e11 cell updates; at most 2e11" }] });
    expect(tooLarge).toBe("The run is too large. (sceneVersion: 3.1e11 cell updates; at most 2e11)");
  });
});

describe("fallback refetch", () => {
  const queue = (states: RunJobItem["state"][]) => ({ jobs: states.map((state, i) => makeJob({ id: String(i), state })), sweeps: [], limits: { maxActiveJobs: 60, maxCellStepsPerJob: 2e11, maxActiveCellSteps: 2e12, activeJobs: 0, activeCellSteps: 0 }, workers: [] });
  it("refetches every 5 s while something runs, slower while only queued, and not at all when everything is finished", () => {
    expect(queueRefetchInterval(queue(["completed", "running"]))).toBe(5000);
    expect(queueRefetchInterval(queue(["queued", "failed"]))).toBe(15000);
    expect(queueRefetchInterval(queue(["completed", "cancelled"]))).toBe(false);
    expect(queueRefetchInterval(undefined)).toBe(false);
  });
});
