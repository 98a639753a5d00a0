import { describe, expect, it } from "vitest";
import { describeActivity, sentenceText, type SentenceInput } from "@/lib/collaboration/activity-sentences";

// The run queue's activity entries (issue 8) read as sentences like every other entry.

const studyId = "11111111-1111-4111-8111-111111111111";
const runId = "22222222-2222-4222-8222-222222222222";

function says(overrides: Partial<SentenceInput>): string {
  return sentenceText(
    describeActivity({ action: "job.queued", subjectType: "job", subjectId: "j1", actorId: "tomas", actorName: "Tomas Lindgren", detail: {}, studyId, studyTitle: "Station Road", runId: null, runLabel: null, sceneName: null, ...overrides }),
  );
}

describe("run queue activity sentences", () => {
  it("names queuing, completion, failure and cancelling of a server run", () => {
    const scene = { sceneName: "Barrier 3 m", sceneVersion: 4 };
    expect(says({ detail: scene })).toBe("Tomas Lindgren queued a server run of Barrier 3 m, version 4");
    expect(says({ action: "job.completed", detail: scene, runId, runLabel: { studyId, sceneName: "Barrier 3 m", sceneVersion: 4 } })).toBe("Tomas Lindgren ran the run of Barrier 3 m, version 4 on the server");
    expect(says({ action: "job.failed", detail: { ...scene, attempts: 3, message: "the run's thread ended" } })).toBe("Tomas Lindgren could not run Barrier 3 m, version 4 on the server after 3 attempts: “the run's thread ended”");
    expect(says({ action: "job.cancelled", detail: { ...scene, whileRunning: true } })).toBe("Tomas Lindgren cancelled the running server run of Barrier 3 m, version 4");
    expect(says({ action: "job.cancelled", detail: scene })).toBe("Tomas Lindgren cancelled a queued server run of Barrier 3 m, version 4");
  });

  it("names a server sweep queued and finished, with what became of it", () => {
    expect(says({ action: "sweep.queued", subjectType: "sweep", detail: { sceneName: "Barrier 3 m", sceneVersion: 4, label: "Height of Barrier, 6 values" } })).toBe(
      "Tomas Lindgren queued a server sweep (Height of Barrier, 6 values) of Barrier 3 m, version 4",
    );
    expect(says({ action: "sweep.completed", subjectType: "sweep", detail: { label: "Height of Barrier, 6 values", state: "completed", message: "" } })).toBe(
      "Tomas Lindgren ran the server sweep Height of Barrier, 6 values; its insertion-loss chart is in the notebook",
    );
    expect(says({ action: "sweep.completed", subjectType: "sweep", detail: { label: "Height", state: "cancelled", message: "Cancelled before any case finished." } })).toBe(
      "Tomas Lindgren ran the server sweep Height, which was cancelled: Cancelled before any case finished.",
    );
  });
});
