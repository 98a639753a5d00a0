// The command-line runner, run as a user would: a small scene in, traces, summary and image out;
// a bad scene file gives one error per problem with its JSON path and exit code 1.
import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";

import { PNG } from "pngjs";
import { afterAll, describe, expect, it } from "vitest";

const repo = resolve(__dirname, "../..");
const work = mkdtempSync(join(tmpdir(), "rarefact-simulate-"));
afterAll(() => rmSync(work, { recursive: true, force: true }));

function simulate(args: string[]) {
  return spawnSync(process.execPath, ["--import", "tsx", join(repo, "scripts/simulate.ts"), ...args], { cwd: repo, encoding: "utf8" });
}

const smallScene = {
  version: 1,
  name: "cli test",
  domain: { width: 1, height: 0.6 },
  resolution: { kind: "cellSize", cellSize: 0.02 },
  boundary: { bottom: { kind: "rigid" } },
  geometry: { walls: [{ id: "screen", label: "Screen", path: [{ x: 0.5, y: 0 }, { x: 0.5, y: 0.3 }], thickness: 0.04 }] },
  sources: [{ id: "src", label: "Source", position: { x: 0.2, y: 0.1 }, signal: { kind: "ricker", peakFrequency: 600 } }],
  receivers: [{ id: "behind", label: "Behind", position: { x: 0.8, y: 0.1 } }],
  duration: { kind: "time", seconds: 0.005 },
};

describe("npm run simulate", () => {
  it("writes traces (CSV and JSON), a summary and a PNG of the final pressure", () => {
    const scenePath = join(work, "small.json");
    writeFileSync(scenePath, JSON.stringify(smallScene));
    const out = join(work, "out");
    const run = simulate([scenePath, "--out", out, "--quiet"]);
    expect(run.stderr).toBe("");
    expect(run.status).toBe(0);
    for (const file of ["traces.csv", "traces.json", "summary.json", "final-pressure.png"]) expect(existsSync(join(out, file))).toBe(true);
    const summary = JSON.parse(readFileSync(join(out, "summary.json"), "utf8"));
    expect(summary.stoppedBy).toBe("duration");
    expect(summary.grid.cellSize).toBe(0.02);
    expect(summary.kernel).toBe("wasm-simd");
    const csv = readFileSync(join(out, "traces.csv"), "utf8").trim().split("\n");
    expect(csv[0]).toBe("time_s,behind_p_Pa,behind_vx_m_per_s,behind_vy_m_per_s");
    expect(csv).toHaveLength(summary.stepsRun + 2);
    const traces = JSON.parse(readFileSync(join(out, "traces.json"), "utf8"));
    expect(traces.receivers[0].pressure).toHaveLength(summary.stepsRun + 1);
    expect(Math.max(...traces.receivers[0].pressure.map(Math.abs))).toBeGreaterThan(0);
    const png = PNG.sync.read(readFileSync(join(out, "final-pressure.png")));
    expect(png.width % 50).toBe(0);
  });

  it("reports every problem of a bad scene file with its JSON path and exits with code 1", () => {
    const scenePath = join(work, "bad.json");
    const bad = { ...smallScene, resolution: { kind: "cellSize", cellSize: 0.02, courantNumber: 0.8 }, sources: [{ id: "src", label: "Source", position: { x: 0.2 }, signal: { kind: "ricker", peakFrequency: -5 } }] };
    writeFileSync(scenePath, JSON.stringify(bad));
    const run = simulate([scenePath, "--out", join(work, "never")]);
    expect(run.status).toBe(1);
    const lines = run.stderr.trim().split("\n");
    expect(lines.filter((l) => l.startsWith(scenePath)).map((l) => l.slice(scenePath.length + 2).split(":")[0]).sort()).toEqual([
      "resolution.courantNumber",
      "sources[0].position.y",
      "sources[0].signal.peakFrequency",
    ]);
    expect(existsSync(join(work, "never"))).toBe(false);
  });

  it("rejects a file that is not JSON with one clear error", () => {
    const scenePath = join(work, "broken.json");
    writeFileSync(scenePath, "{ version: 1");
    const run = simulate([scenePath]);
    expect(run.status).toBe(1);
    expect(run.stderr).toMatch(/not valid JSON/);
  });
});
