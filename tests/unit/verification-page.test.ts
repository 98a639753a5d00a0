// The verification page shows exactly the cases `npm test` runs (one definition), and what it saves of
// them: thinned curves, verdicts judged from the checks, the browser's name, a report's summary of them.
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { caseSceneFacts, pageVerificationCases } from "@/components/verification/model/case-list";
import { decisiveCheck, solverMismatch, toleranceUsed } from "@/components/verification/model/evidence";
import { verificationCases, type VerificationCase } from "@/lib/verification/cases";
import { makeCeilingCheck, makeCheck, makeOutcome, makeRelativeCheck } from "@/lib/verification/cases/outcome";
import { browserLabel, describeBrowser, recordCounts, savedCaseOutcome, thinSeries } from "@/lib/verification/saved-record";
import { MAX_SAVED_SERIES_POINTS, verificationRecordInputSchema } from "@/lib/validation/verification";

const verificationTests = path.join(process.cwd(), "tests/verification");

/** The cases the test files under tests/verification run: each imports its case from lib/verification/cases. */
async function casesRunByTests(): Promise<VerificationCase[]> {
  const found: VerificationCase[] = [];
  for (const file of fs.readdirSync(verificationTests).filter((name) => name.endsWith(".test.ts"))) {
    const source = fs.readFileSync(path.join(verificationTests, file), "utf8");
    for (const match of source.matchAll(/import\s*\{([^}]+)\}\s*from\s*"@\/lib\/verification\/cases\/([a-z-]+)"/g)) {
      const imported = (await import(`@/lib/verification/cases/${match[2]}.ts`)) as Record<string, unknown>;
      for (const name of match[1]!.split(",").map((part) => part.trim())) {
        const value = imported[name];
        if (value && typeof value === "object" && "run" in value && "id" in value) found.push(value as VerificationCase);
      }
    }
  }
  return found;
}

describe("the verification page's cases", () => {
  it("is the shared list itself, not a copy", () => {
    expect(pageVerificationCases).toBe(verificationCases);
  });

  it("lists exactly the cases the verification tests run, each run by a test, none left out", async () => {
    const tested = await casesRunByTests();
    const byId = new Map(tested.map((c) => [c.id, c]));
    expect([...byId.keys()].sort()).toEqual(pageVerificationCases.map((c) => c.id).sort());
    // The same objects: a test cannot run a private variant of a case the page shows.
    for (const c of pageVerificationCases) expect(byId.get(c.id), c.id).toBe(c);
  });

  it("covers the six subjects of issue 9", () => {
    const ids = pageVerificationCases.map((c) => c.id);
    for (const id of ["free-field", "room-modes", "dispersion", "impedance-wall", "pml", "half-plane", "band-levels"]) expect(ids).toContain(id);
  });

  it("states the grid of every simulated case in figures, and none for the synthesised signal", () => {
    for (const c of pageVerificationCases) {
      const facts = caseSceneFacts(c);
      if (!c.scene) expect(facts, c.id).toBeNull();
      else {
        expect(facts, c.id).not.toBeNull();
        expect(facts!.grid.cellCount, c.id).toBeGreaterThan(0);
        expect(facts!.rows.map(([label]) => label), c.id).toContain("Cell size");
      }
    }
  });
});

describe("what a verification record keeps", () => {
  it("thins a long series to the saved limit, keeping the extremes of every stretch (a one-sample peak survives)", () => {
    const x = Array.from({ length: 10_000 }, (_, k) => k);
    const y = x.map(() => 0);
    y[4567] = 5;
    y[8000] = -3;
    const thinned = thinSeries({ name: "s", kind: "simulated", x, y });
    expect(thinned.x.length).toBeLessThanOrEqual(MAX_SAVED_SERIES_POINTS);
    expect(Math.max(...(thinned.y as number[]))).toBe(5);
    expect(Math.min(...(thinned.y as number[]))).toBe(-3);
    expect(thinned.x[thinned.y.indexOf(5)]).toBe(4567);
    const xs = thinned.x as number[];
    for (let k = 1; k < xs.length; k++) expect(xs[k]).toBeGreaterThan(xs[k - 1]!);
  });

  it("keeps a short series whole, to six significant digits, and NaN as null", () => {
    const thinned = thinSeries({ name: "s", kind: "exact", x: [1, 2, 3], y: [Math.PI, NaN, 1 / 3], style: "points" });
    expect(thinned).toEqual({ name: "s", kind: "exact", x: [1, 2, 3], y: [3.14159, null, 0.333333], style: "points" });
  });

  it("judges a case again from its checks and counts passed and failed cases", () => {
    const outcome = makeOutcome([makeCheck("a", 1.01, 1, 0.03, "dB"), makeRelativeCheck("b", NaN, 100, 0.005, "Hz")], [], 0);
    const saved = savedCaseOutcome({ id: "x", title: "X" }, { ...outcome, pass: true });
    expect(saved.pass).toBe(false);
    expect(saved.checks[1]!.measured).toBeNull();
    expect(recordCounts([saved, { checks: [{ pass: true }] }, { checks: [] }])).toEqual({ passedCount: 1, failedCount: 2 });
  });

  it("passes a saved outcome through the record schema after a JSON round trip", () => {
    const outcome = makeOutcome([makeCheck("a", NaN, 1, 0.03, "dB")], [{ title: "t", xLabel: "x", yLabel: "y", series: [{ name: "s", kind: "simulated", x: [1, 2], y: [Infinity, 2] }] }], 0);
    const body = JSON.parse(JSON.stringify({ solverVersion: "v", browser: "Linux | agent", kernel: "wasm-simd", outcomes: [savedCaseOutcome({ id: "x", title: "X" }, outcome)] }));
    expect(verificationRecordInputSchema.safeParse(body).success).toBe(true);
    body.outcomes[0].curves[0].series[0].x = Array.from({ length: MAX_SAVED_SERIES_POINTS + 1 }, () => 1);
    expect(verificationRecordInputSchema.safeParse(body).success).toBe(false);
  });

  it("fits the record schema with real outcomes: the widest curve (impedance wall, 12 series) and the most checks (band levels)", () => {
    // 20 cells per wavelength at 500 Hz (impedance wall) and 48 kHz sampling (band levels): about 2 s together.
    const outcomes = ["impedance-wall", "band-levels"].map((id) => {
      const verificationCase = pageVerificationCases.find((c) => c.id === id)!;
      return savedCaseOutcome(verificationCase, verificationCase.run());
    });
    const body = JSON.parse(JSON.stringify({ solverVersion: "v", browser: describeBrowser("Linux", "agent"), kernel: "wasm-simd", outcomes }));
    const parsed = verificationRecordInputSchema.safeParse(body);
    expect(parsed.success ? [] : parsed.error.issues.map((issue) => `${issue.path.join(".")}: ${issue.message}`)).toEqual([]);
  });

  it("names the browser from its user agent and platform", () => {
    const chrome = "Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/139.0.0.0 Safari/537.36";
    expect(browserLabel(describeBrowser("Linux", chrome))).toBe("Chrome 139 on Linux");
    expect(browserLabel(describeBrowser("Linux", chrome.replace("Chrome/", "HeadlessChrome/")))).toBe("Headless Chrome 139 on Linux");
    expect(browserLabel(describeBrowser("macOS", "Mozilla/5.0 (Macintosh; Intel Mac OS X 14_5) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.5 Safari/605.1.15"))).toBe("Safari 17 on macOS");
    expect(browserLabel(describeBrowser("Windows", "Mozilla/5.0 (Windows NT 10.0; Win64; x64; rv:128.0) Gecko/20100101 Firefox/128.0"))).toBe("Firefox 128 on Windows");
  });
});

describe("a report's summary of attached results", () => {
  it("picks a failed check first, else the one that used most of its tolerance", () => {
    const near = makeCheck("near", 1.025, 1, 0.03, "dB");
    const far = makeCheck("far", 1.001, 1, 0.03, "dB");
    const failed = makeCeilingCheck("ceiling", -20, -30, "dB");
    expect(decisiveCheck([far, near])?.label).toBe("near");
    expect(decisiveCheck([far, failed, near])?.label).toBe("ceiling");
    expect(decisiveCheck([])).toBeUndefined();
    expect(toleranceUsed(makeCeilingCheck("ok", -45, -40, "dB"))).toBe(0);
  });

  it("warns when the results were made with another solver version than the run", () => {
    expect(solverMismatch("rarefact-fdtd-2d/1", "rarefact-fdtd-2d/1")).toBeNull();
    expect(solverMismatch("rarefact-fdtd-2d/1", "rarefact-fdtd-2d/2")).toMatch(/rarefact-fdtd-2d\/1.*rarefact-fdtd-2d\/2/);
  });
});
