import { describe, expect, it } from "vitest";
import { formatGrid, formatWallTime, matchesRunFilter, toRunTableRow } from "@/components/runs/run-table-model";
import type { RunListItem } from "@/lib/http/api-types";

function listItem(overrides: Partial<RunListItem> = {}): RunListItem {
  return {
    id: "00000000-0000-4000-8000-000000000001",
    studyId: "00000000-0000-4000-8000-000000000002",
    sceneId: "00000000-0000-4000-8000-000000000003",
    sceneName: "Barrier 3 m",
    sceneVersion: 4,
    status: "completed",
    statusMessage: "",
    createdById: "u1",
    createdByName: "Inès Marlow",
    createdAt: "2026-03-02T10:00:00.000Z",
    inputHash: "a".repeat(64),
    solverVersion: "test",
    resultBytes: 1000,
    reviewState: "unreviewed",
    signOff: null,
    sceneCurrentVersion: 4,
    figures: {
      grid: { nx: 200, ny: 100, cells: 20_000, domainNx: 180, domainNy: 90, cellSize: 0.025, timeStep: 1e-5 },
      steps: { planned: 100, run: 100 },
      simulatedSeconds: 0.001,
      stoppedBy: "duration",
      wallSeconds: 75,
      cellUpdatesPerSecond: 1e8,
      engine: { kernel: "wasm-simd", threads: 2 },
      receiverCount: 3,
      loudestPeakLevelDb: 91.25,
      snapshotFrames: 10,
      warningCount: 2,
    },
    ...overrides,
  };
}

describe("run table rows", () => {
  it("names the variant by scene and version and carries the figures as numbers", () => {
    const row = toRunTableRow(listItem());
    expect(row.variant).toBe("Barrier 3 m v4");
    expect(row.wallSeconds).toBe(75);
    expect(row.cells).toBe(20_000);
    expect(row.warningCount).toBe(2);
    expect(row.loudestPeakLevelDb).toBe(91.25);
    expect(row.createdAtMs).toBe(Date.parse("2026-03-02T10:00:00.000Z"));
  });

  it("keeps a run whose scene and author are gone, without figures", () => {
    const row = toRunTableRow(listItem({ sceneName: null, createdByName: null, figures: null }));
    expect(row.variant).toBe("Deleted scene v4");
    expect(row.who).toBe("Former member");
    expect(row.wallSeconds).toBeNull();
    expect(row.loudestPeakLevelDb).toBeNull();
  });
});

describe("filtering runs", () => {
  const row = toRunTableRow(listItem());

  it("matches every typed word against the variant or the person, ignoring case and accents", () => {
    expect(matchesRunFilter(row, { text: "barrier ines", status: "all" })).toBe(true);
    expect(matchesRunFilter(row, { text: "V4", status: "all" })).toBe(true);
    expect(matchesRunFilter(row, { text: "barrier tomas", status: "all" })).toBe(false);
  });

  it("filters by status, and an empty text matches everything", () => {
    expect(matchesRunFilter(row, { text: "  ", status: "completed" })).toBe(true);
    expect(matchesRunFilter(row, { text: "", status: "cancelled" })).toBe(false);
  });
});

describe("run table figures", () => {
  it("formats wall time in seconds, minutes or hours", () => {
    expect(formatWallTime(4.26)).toBe("4.3 s");
    expect(formatWallTime(75)).toBe("1 min 15 s");
    expect(formatWallTime(3 * 3600 + 120)).toBe("3 h 2 min");
    expect(formatWallTime(null)).toBe("–");
  });

  it("states the grid as cells and cell size", () => {
    expect(formatGrid(20_000, 0.025)).toBe("20 k cells, dx 25 mm");
    expect(formatGrid(2_500_000, 0.005)).toBe("2.5 M cells, dx 5 mm");
    expect(formatGrid(null, 0.01)).toBe("–");
  });
});
