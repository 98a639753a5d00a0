import { describe, expect, it } from "vitest";
import { blockCreateSchema, chartContentSchema } from "@/lib/validation/blocks";
import { definition, results } from "./fixtures";

const runId = "3f2b8a4e-1c7d-4e2a-9b1f-6d5c4b3a2910";

describe("chart content with a sweep", () => {
  it("still accepts a chart of saved runs as before", () => {
    expect(chartContentSchema.safeParse({ runIds: [runId], quantity: "band-levels" }).success).toBe(true);
    expect(blockCreateSchema.safeParse({ kind: "chart", content: { runIds: [], quantity: "trace" } }).success).toBe(true);
  });

  it("accepts a sweep chart holding its definition and results", () => {
    expect(chartContentSchema.safeParse({ runIds: [], quantity: "sweep", sweep: { definition, results } }).success).toBe(true);
  });

  it("refuses a sweep chart without a sweep, and a sweep in another chart", () => {
    expect(chartContentSchema.safeParse({ runIds: [], quantity: "sweep" }).error?.issues[0]?.path).toEqual(["sweep"]);
    expect(chartContentSchema.safeParse({ runIds: [], quantity: "trace", sweep: { definition, results } }).success).toBe(false);
  });

  it("refuses results whose arrays do not match the values, receivers and bands", () => {
    const short = { ...results, insertionLoss: results.insertionLoss.slice(1) };
    const issue = chartContentSchema.safeParse({ runIds: [], quantity: "sweep", sweep: { definition, results: short } }).error?.issues[0];
    expect(issue?.path).toEqual(["sweep", "results", "insertionLoss"]);
    const otherReceivers = { ...definition, receiverIds: ["window", "garden"] };
    expect(chartContentSchema.safeParse({ runIds: [], quantity: "sweep", sweep: { definition: otherReceivers, results } }).success).toBe(false);
    const notANumber = { ...results, overall: [[Number.NaN, 1], [null, null], [1, 1]] };
    expect(chartContentSchema.safeParse({ runIds: [], quantity: "sweep", sweep: { definition, results: notANumber } }).success).toBe(false);
  });
});
