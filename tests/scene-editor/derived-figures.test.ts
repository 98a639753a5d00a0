import { describe, expect, it } from "vitest";

import { BROWSER_MEMORY_LIMIT_BYTES, deriveFigures, estimateRunSeconds, formatRunTime } from "@/components/scene-editor/model/derived-figures";
import { setDomain, setResolution, setSourceSignal } from "@/components/scene-editor/model/scene-edits";
import { deriveGrid } from "@/lib/fdtd/grid";
import { defaultSceneLimits } from "@/lib/validation/scene-limits";

import { barrierScene } from "./scene-fixtures";

describe("derived numbers", () => {
  it("estimates the run time as the run's cell updates over the measured rate", () => {
    const grid = deriveGrid(barrierScene());
    expect(estimateRunSeconds(grid, 2e8)).toBe(grid.cellUpdates / 2e8);
    expect(estimateRunSeconds(grid, 0)).toBeNull();
    expect(estimateRunSeconds(grid, null)).toBeNull();
    expect(deriveFigures(barrierScene(), 1e8).estimatedRunSeconds).toBe(grid.cellUpdates / 1e8);
  });

  it("raises no concern for a modest scene", () => {
    expect(deriveFigures(barrierScene(), null).concerns).toEqual([]);
  });

  it("passes on the solver's warning when a source reaches above the resolved band", () => {
    // 500 Hz at 10 cells per wavelength; a Ricker pulse peaking at 300 Hz has energy to about 850 Hz.
    const scene = setSourceSignal(barrierScene(), "road", { kind: "ricker", peakFrequency: 300 });
    const concerns = deriveFigures(scene, null).concerns;
    expect(concerns).toEqual([expect.objectContaining({ level: "check", path: "sources[0].signal" })]);
  });

  it("warns that a grid over 1 GB is too large for a browser tab, and shows the server's limits only when exceeded", () => {
    // 200 m x 80 m at 2 cm cells: 10 000 x 4 000 cells in the domain alone.
    const big = setResolution(setDomain(barrierScene(), 200, 80), { kind: "cellSize", cellSize: 0.02, courantNumber: 0.6 });
    const figures = deriveFigures(big, null);
    expect(figures.grid.memoryBytes).toBeGreaterThan(BROWSER_MEMORY_LIMIT_BYTES);
    expect(figures.concerns.map((c) => c.level)).toContain("browser");
    expect(figures.grid.cellCount).toBeGreaterThan(defaultSceneLimits.maxCells);
    expect(figures.concerns.find((c) => c.level === "limit")).toMatchObject({ path: "resolution" });
  });

  it("writes run times the way a person reads them", () => {
    expect(formatRunTime(0.42)).toBe("0.42 s");
    expect(formatRunTime(59.6)).toBe("1 min 00 s");
    expect(formatRunTime(200)).toBe("3 min 20 s");
    expect(formatRunTime(7500)).toBe("2 h 05 min");
  });
});
