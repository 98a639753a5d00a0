import { describe, expect, it } from "vitest";
import { buildScene } from "@/lib/fdtd/builders";
import { checkPayloadAgainstScene } from "@/lib/run-record/scene-match";
import { decodeRunPayload, encodeRunPayload, type RunPayloadHeader } from "@/lib/run-record/payload";
import { tinyRun, tinySceneInput } from "./fixtures";

function tinyHeader(): RunPayloadHeader {
  const { scene, result } = tinyRun();
  const encoded = encodeRunPayload({ result, scene, sceneVersion: 1 });
  if (!encoded.ok) throw new Error(encoded.message);
  const decoded = decodeRunPayload(encoded.bytes);
  if (!decoded.ok) throw new Error(decoded.message);
  return decoded.run.header;
}

describe("a payload checked against its scene", () => {
  it("agrees with the scene it was run from", () => {
    expect(checkPayloadAgainstScene(tinyHeader(), tinyRun().scene)).toEqual([]);
  });

  it("names the grid when the scene implies another one", () => {
    const finer = buildScene({ ...tinySceneInput(), resolution: { kind: "cellSize", cellSize: 0.01 } });
    expect(checkPayloadAgainstScene(tinyHeader(), finer).map((issue) => issue.path)).toEqual(["grid"]);
  });

  it("names the receivers, snapshots and maps the scene does not have", () => {
    const other = buildScene({ ...tinySceneInput(), receivers: [{ id: "elsewhere", label: "Elsewhere", position: { x: 0.2, y: 0.1 } }], output: { levelMaps: false } });
    const paths = checkPayloadAgainstScene(tinyHeader(), other).map((issue) => issue.path);
    expect(paths).toEqual(expect.arrayContaining(["receivers[0]", "snapshots", "levelMaps", "intensity"]));
  });

  it("refuses a run that claims to have reached its duration early", () => {
    const header = tinyHeader();
    const shortened = { ...header, run: { ...header.run, stepsRun: header.run.stepsRun - 1 } };
    expect(checkPayloadAgainstScene(shortened, tinyRun().scene).map((issue) => issue.path)).toContain("run.stepsRun");
  });
});
