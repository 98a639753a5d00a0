// Which runs can be paired: an insertion-loss reference needs the same grid, duration and receivers; an
// overlay the same sampling and receiver ids. Each refusal names what differs.
import { describe, expect, it } from "vitest";

import { levelMapCompatibility, overlayListCompatibility, overlayPayloadCompatibility, referenceListCompatibility, referencePayloadCompatibility } from "@/lib/analysis/run-compatibility";
import type { RunListItem } from "@/lib/http/api-types";
import type { RunPayloadHeader } from "@/lib/run-record/header";
import { defaultRunSettings } from "@/lib/run-record/settings";

const field = { width: 40, height: 20, x0: 0.05, y0: 0.05, spacing: 0.1 };

function makeHeader(overrides: Partial<RunPayloadHeader> = {}): RunPayloadHeader {
  return {
    format: 1,
    solverVersion: "test",
    sceneVersion: 1,
    inputHash: "0".repeat(64),
    settings: defaultRunSettings,
    scene: {},
    engine: { kernel: "typescript", threads: 1 },
    grid: { nx: 80, ny: 60, domainNx: 40, domainNy: 20, cellSize: 0.1, timeStep: 1.2e-4, plannedSteps: 500 },
    run: { stepsRun: 500, simulatedSeconds: 0.06, stoppedBy: "duration", setupSeconds: 0, runSeconds: 1, cellUpdatesPerSecond: 1 },
    warnings: [],
    sources: [{ id: "s", label: "Source", x: 1, y: 1 }],
    receivers: [
      { id: "r1", label: "Garden", x: 3, y: 1.5 },
      { id: "r2", label: "Window", x: 3.5, y: 1.5 },
    ],
    energy: [],
    snapshots: { frameStride: 1, cellStride: 1, field, frames: [] },
    finalPressure: { cellStride: 1, field, frame: { step: 500, time: 0.06, scale: 1 } },
    levelMaps: { field, samples: 500, block: 1 },
    sections: [],
    ...overrides,
  };
}

function listed(overrides: Partial<RunListItem> = {}, figures: Partial<NonNullable<RunListItem["figures"]>> = {}): RunListItem {
  return {
    id: "other",
    studyId: "study",
    sceneId: "scene",
    sceneName: "Reference",
    sceneVersion: 1,
    status: "completed",
    statusMessage: "",
    createdById: null,
    createdByName: null,
    createdAt: "2026-01-01T00:00:00Z",
    inputHash: "1".repeat(64),
    solverVersion: "test",
    resultBytes: 1,
    reviewState: "unreviewed",
    signOff: null,
    sceneCurrentVersion: 1,
    figures: {
      grid: { nx: 80, ny: 60, cells: 4800, domainNx: 40, domainNy: 20, cellSize: 0.1, timeStep: 1.2e-4 },
      steps: { planned: 500, run: 500 },
      simulatedSeconds: 0.06,
      stoppedBy: "duration",
      wallSeconds: 1,
      cellUpdatesPerSecond: 1,
      engine: { kernel: "typescript", threads: 1 },
      receiverCount: 2,
      loudestPeakLevelDb: 90,
      snapshotFrames: 0,
      warningCount: 0,
      ...figures,
    },
    ...overrides,
  };
}

const current = makeHeader();
const reasonOf = (outcome: { ok: boolean; reason?: string }) => (outcome.ok ? "ok" : outcome.reason);

describe("insertion-loss reference from the run list", () => {
  it("accepts a completed run on the same grid with the same duration and receiver count", () => {
    expect(referenceListCompatibility(current, "this", listed())).toEqual({ ok: true });
  });

  it("refuses the run itself, an unfinished run and one without figures", () => {
    expect(reasonOf(referenceListCompatibility(current, "other", listed()))).toBe("it is this run");
    expect(reasonOf(referenceListCompatibility(current, "this", listed({ status: "cancelled" })))).toBe("it is cancelled, not completed");
    expect(reasonOf(referenceListCompatibility(current, "this", listed({ figures: null })))).toBe("it has no summary to compare");
  });

  it("names a different grid, duration or receiver count", () => {
    const grid = { nx: 80, ny: 60, cells: 4800, domainNx: 40, domainNy: 20, cellSize: 0.05, timeStep: 1.2e-4 };
    expect(reasonOf(referenceListCompatibility(current, "this", listed({}, { grid })))).toMatch(/^its grid differs \(80 x 60 cells of 0\.05000 m/);
    expect(reasonOf(referenceListCompatibility(current, "this", listed({}, { steps: { planned: 500, run: 400 } })))).toMatch(/ran 400 steps; this run ran 500/);
    expect(reasonOf(referenceListCompatibility(current, "this", listed({}, { receiverCount: 3 })))).toBe("it has 3 receivers; this run has 2");
  });
});

describe("insertion-loss reference once loaded", () => {
  it("accepts the same receivers at the same places", () => {
    expect(referencePayloadCompatibility(current, makeHeader())).toEqual({ ok: true });
  });

  it("names a missing receiver, an extra one, and one that moved by more than half a cell", () => {
    const missing = makeHeader({ receivers: [current.receivers[0]!, { id: "r3", label: "Other", x: 3.5, y: 1.5 }] });
    expect(reasonOf(referencePayloadCompatibility(current, missing))).toBe("it has no receiver r2");
    const moved = makeHeader({ receivers: [current.receivers[0]!, { ...current.receivers[1]!, x: 3.6 }] });
    expect(reasonOf(referencePayloadCompatibility(current, moved))).toMatch(/^receiver r2 is 0\.100 m from where it is/);
    const nudged = makeHeader({ receivers: [current.receivers[0]!, { ...current.receivers[1]!, x: 3.52 }] });
    expect(referencePayloadCompatibility(current, nudged)).toEqual({ ok: true });
  });

  it("checks the level maps separately, so the band table works without them", () => {
    expect(levelMapCompatibility(current, makeHeader())).toEqual({ ok: true });
    expect(reasonOf(levelMapCompatibility(current, makeHeader({ levelMaps: undefined })))).toBe("the reference kept no level maps");
    expect(reasonOf(levelMapCompatibility(current, makeHeader({ levelMaps: { field: { ...field, width: 20 }, samples: 500, block: 2 } })))).toMatch(/differ in size/);
  });
});

describe("overlays", () => {
  it("need the same sampling and receiver ids but not the same positions or duration", () => {
    expect(overlayListCompatibility(current, "this", listed({}, { steps: { planned: 900, run: 900 } }))).toEqual({ ok: true });
    const grid = { nx: 80, ny: 60, cells: 4800, domainNx: 40, domainNy: 20, cellSize: 0.1, timeStep: 1e-4 };
    expect(reasonOf(overlayListCompatibility(current, "this", listed({}, { grid })))).toMatch(/sampled every 100\.0 us/);
    const moved = makeHeader({ receivers: current.receivers.map((r) => ({ ...r, x: r.x + 5 })), run: { ...current.run, stepsRun: 900 } });
    expect(overlayPayloadCompatibility(current, moved)).toEqual({ ok: true });
    const renamed = makeHeader({ receivers: [current.receivers[0]!, { ...current.receivers[1]!, id: "r9" }] });
    expect(reasonOf(overlayPayloadCompatibility(current, renamed))).toBe("it has no receiver r2");
  });
});
