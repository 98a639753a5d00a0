// Chart blocks of saved runs: what their content may hold. Charts stored before the display options
// existed must stay valid, and options that do not fit the quantity are refused with the field named.
import { describe, expect, it } from "vitest";
import { chartContentSchema } from "@/lib/validation/blocks";
import { definition, results } from "../sweeps/fixtures";

const runA = "3f2b8c1e-5d4a-4b6c-9e8f-1a2b3c4d5e6f";
const runB = "7a6b5c4d-3e2f-4a1b-8c9d-0e1f2a3b4c5d";

function firstIssuePath(content: unknown): string | undefined {
  const parsed = chartContentSchema.safeParse(content);
  return parsed.success ? undefined : parsed.error.issues[0]?.path.join(".");
}

describe("chart block content", () => {
  it("keeps content stored before the display options existed valid", () => {
    expect(chartContentSchema.safeParse({ runIds: [runA], quantity: "band-levels" }).success).toBe(true);
    expect(chartContentSchema.safeParse({ runIds: [runA, runB], quantity: "trace" }).success).toBe(true);
    expect(chartContentSchema.safeParse({ runIds: [], quantity: "sweep", sweep: { definition, results } }).success).toBe(true);
  });

  it("accepts the choices a band-level panel keeps", () => {
    const parsed = chartContentSchema.parse({ runIds: [runA], quantity: "band-levels", receiverIds: ["garden", "terrace"], bandsPerOctave: 3, weighting: "A", title: "  Gardens, A-weighted  ", runLabels: ["Design A v2"] });
    expect(parsed).toMatchObject({ bandsPerOctave: 3, weighting: "A", receiverIds: ["garden", "terrace"], title: "Gardens, A-weighted" });
  });

  it("refuses bands per octave other than 1 or 3, and weightings other than Z or A", () => {
    expect(firstIssuePath({ runIds: [runA], quantity: "band-levels", bandsPerOctave: 6 })).toBe("bandsPerOctave");
    expect(firstIssuePath({ runIds: [runA], quantity: "band-levels", weighting: "C" })).toBe("weighting");
  });

  it("refuses bands and weighting on a trace or spectrum chart", () => {
    expect(firstIssuePath({ runIds: [runA], quantity: "trace", bandsPerOctave: 1 })).toBe("bandsPerOctave");
    expect(firstIssuePath({ runIds: [runA], quantity: "spectrum", weighting: "A" })).toBe("weighting");
  });

  it("refuses a title over 200 characters or an empty one", () => {
    expect(firstIssuePath({ runIds: [runA], quantity: "trace", title: "x".repeat(201) })).toBe("title");
    expect(chartContentSchema.safeParse({ runIds: [runA], quantity: "trace", title: "x".repeat(200) }).success).toBe(true);
    expect(firstIssuePath({ runIds: [runA], quantity: "trace", title: "   " })).toBe("title");
  });

  it("refuses an empty, repeated or over-long receiver list", () => {
    expect(firstIssuePath({ runIds: [runA], quantity: "trace", receiverIds: [] })).toBe("receiverIds");
    expect(firstIssuePath({ runIds: [runA], quantity: "trace", receiverIds: ["a", "a"] })).toBe("receiverIds");
    expect(firstIssuePath({ runIds: [runA], quantity: "trace", receiverIds: Array.from({ length: 13 }, (_, i) => `r${i}`) })).toBe("receiverIds");
  });

  it("needs exactly two runs, the run and its reference, for insertion loss", () => {
    expect(firstIssuePath({ runIds: [runA], quantity: "insertion-loss" })).toBe("runIds");
    expect(chartContentSchema.safeParse({ runIds: [runA, runB], quantity: "insertion-loss", bandsPerOctave: 1, weighting: "Z" }).success).toBe(true);
    expect(firstIssuePath({ runIds: [runA, runA], quantity: "insertion-loss" })).toBe("runIds");
    expect(firstIssuePath({ runIds: [runA, runB, "0b1c2d3e-4f5a-4b6c-8d7e-9f0a1b2c3d4e"], quantity: "insertion-loss" })).toBe("runIds");
  });

  it("needs one label per run when labels are kept", () => {
    expect(firstIssuePath({ runIds: [runA, runB], quantity: "trace", runLabels: ["only one"] })).toBe("runLabels");
  });

  it("refuses display options on a sweep chart, which keeps its own in its definition", () => {
    expect(firstIssuePath({ runIds: [], quantity: "sweep", sweep: { definition, results }, weighting: "A" })).toBe("weighting");
  });
});
