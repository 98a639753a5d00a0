import { describe, expect, it } from "vitest";
import { zlibSync } from "fflate";
import type { SimulationResult } from "@/lib/fdtd/simulation";
import { crc32 } from "@/lib/run-record/checksums";
import { FRAME_PREAMBLE_BYTES, frameBody, RUN_PAYLOAD_MAGIC } from "@/lib/run-record/frame";
import { RUN_PAYLOAD_FORMAT } from "@/lib/run-record/header";
import { MAX_RUN_PAYLOAD_UNCOMPRESSED_BYTES, MAX_TRACE_VALUES } from "@/lib/run-record/limits";
import { checkRunPayload, decodeRunPayload, encodeRunPayload, type DecodedRun } from "@/lib/run-record/payload";
import { largestMagnitude, snapshotErrorBound } from "@/lib/run-record/quantise";
import type { RunSettings } from "@/lib/run-record/settings";
import { SOLVER_VERSION } from "@/lib/run-record/solver-version";
import { tinyRun } from "./fixtures";
import { bodyOf, flipBit, rewriteHeader } from "./payload-surgery";

function encodeTiny(settings?: RunSettings): { bytes: Uint8Array; result: SimulationResult } {
  const { scene, result } = tinyRun();
  const encoded = encodeRunPayload({ result, scene, sceneVersion: 3, settings, threads: 2 });
  if (!encoded.ok) throw new Error(encoded.message);
  return { bytes: encoded.bytes, result };
}

function decodeOrThrow(bytes: Uint8Array): DecodedRun {
  const decoded = decodeRunPayload(bytes);
  if (!decoded.ok) throw new Error(`${decoded.path}: ${decoded.message}`);
  return decoded.run;
}

/** A preamble for `compressed` declaring `bodyLength`, with a correct CRC. */
function frameWithDeclaredLength(compressed: Uint8Array, bodyLength: number): Uint8Array {
  const framed = new Uint8Array(FRAME_PREAMBLE_BYTES + compressed.length);
  const view = new DataView(framed.buffer);
  for (let i = 0; i < 4; i++) framed[i] = RUN_PAYLOAD_MAGIC.charCodeAt(i);
  view.setUint32(4, RUN_PAYLOAD_FORMAT, true);
  view.setUint32(8, bodyLength, true);
  view.setUint32(12, compressed.length, true);
  framed.set(compressed, FRAME_PREAMBLE_BYTES);
  view.setUint32(16, crc32(compressed, crc32(framed.subarray(0, 16))), true);
  return framed;
}

describe("a saved run's payload", () => {
  it("round-trips the receiver traces exactly, with the header the run implies", () => {
    const { bytes, result } = encodeTiny();
    const run = decodeOrThrow(bytes);
    expect(run.receivers.map((r) => r.id)).toEqual(["rx", "line[0]", "line[1]", "line[2]", "line[3]"]);
    result.receivers.forEach((trace, r) => {
      const decoded = run.receivers[r]!;
      expect(decoded.label).toBe(trace.label);
      expect(decoded.lineId).toBe(trace.lineId);
      expect(decoded.position).toEqual(trace.position);
      expect(decoded.timeStep).toBe(result.grid.timeStep);
      expect(decoded.pressure).toEqual(trace.pressure);
      expect(decoded.velocityX).toEqual(trace.velocityX);
      expect(decoded.velocityY).toEqual(trace.velocityY);
    });
    expect(run.receivers[0]!.pressure.some((p) => p !== 0)).toBe(true);
    const { header } = run;
    expect(header.grid).toEqual({
      nx: result.grid.nx,
      ny: result.grid.ny,
      domainNx: result.grid.domainCells.nx,
      domainNy: result.grid.domainCells.ny,
      cellSize: result.grid.cellSize,
      timeStep: result.grid.timeStep,
      plannedSteps: result.grid.steps,
    });
    expect(header).toMatchObject({ sceneVersion: 3, solverVersion: SOLVER_VERSION, engine: { kernel: result.kernel, threads: 2 } });
    expect(header.run.stepsRun).toBe(result.stepsRun);
    expect(header.snapshots.frames.map((f) => f.step)).toEqual(result.snapshots.map((s) => s.step));
    expect(header.energy).toEqual(result.energy);
  });

  it("round-trips the level and intensity maps exactly when they are within the cap", () => {
    const { bytes, result } = encodeTiny();
    const run = decodeOrThrow(bytes);
    expect(run.levelMaps!.peak.values).toEqual(result.levelMaps!.peak.values);
    expect(run.levelMaps!.rms.values).toEqual(result.levelMaps!.rms.values);
    expect(run.levelMaps!.samples).toBe(result.levelMaps!.samples);
    expect(run.intensity!.x.values).toEqual(result.intensity!.x.values);
    expect(run.intensity!.y.values).toEqual(result.intensity!.y.values);
    const { values: _peakValues, ...peakGeometry } = result.levelMaps!.peak;
    const { values: _decodedValues, ...decodedGeometry } = run.levelMaps!.peak;
    expect(decodedGeometry).toEqual(peakGeometry);
  });

  it("keeps every snapshot within the stated error bound of its frame, and the final field too", () => {
    const { bytes, result } = encodeTiny();
    const run = decodeOrThrow(bytes);
    expect(run.snapshots).toHaveLength(result.snapshots.length);
    // Largest error over each frame as a fraction of that frame's bound: at most 1.
    let worst = 0;
    const frames = [...result.snapshots.map((original, f) => [original, run.snapshots[f]!] as const), [result.finalPressure, run.finalPressure] as const];
    for (const [original, decoded] of frames) {
      expect(decoded.width * decoded.height).toBe(original.values.length);
      expect([decoded.step, decoded.time, decoded.x0, decoded.spacing]).toEqual([original.step, original.time, original.x0, original.spacing]);
      const bound = snapshotErrorBound(largestMagnitude(original.values));
      for (let i = 0; i < original.values.length; i++) {
        const error = Math.abs(decoded.values[i]! - original.values[i]!);
        // A silent frame (bound 0) must come back silent.
        worst = Math.max(worst, bound === 0 ? (error === 0 ? 0 : Infinity) : error / bound);
      }
    }
    expect(worst).toBeLessThanOrEqual(1);
    // The quantisation really happened (the frames are not stored as float32 after all).
    expect(worst).toBeGreaterThan(0.5);
  });

  it("thins snapshots in time and space and coarsens the maps to the limits it is given", () => {
    const settings: RunSettings = { snapshotFrameLimit: 5, snapshotFrameValueLimit: 1024, mapValueLimit: 1024 };
    const { bytes, result } = encodeTiny(settings);
    const run = decodeOrThrow(bytes);
    const every = 4;
    const k = Math.ceil(result.snapshots.length / 5);
    expect(run.header.snapshots.frameStride).toBe(k);
    expect(run.snapshots.length).toBeLessThanOrEqual(5);
    expect(run.snapshots.map((s) => s.step)).toEqual(run.snapshots.map((_, index) => (index + 1) * k * every));
    const original = result.snapshots[k - 1]!;
    const thinned = run.snapshots[0]!;
    const stride = run.header.snapshots.cellStride;
    expect(thinned.width * thinned.height).toBeLessThanOrEqual(1024);
    expect(thinned.width).toBe(Math.ceil(original.width / stride));
    expect(thinned.spacing).toBeCloseTo(original.spacing * stride, 12);
    const bound = snapshotErrorBound(largestMagnitude(original.values));
    expect(Math.abs(thinned.values[thinned.width + 1]! - original.values[stride * original.width + stride]!)).toBeLessThanOrEqual(bound);

    const peak = run.levelMaps!.peak;
    const block = run.header.levelMaps!.block;
    expect(peak.width * peak.height).toBeLessThanOrEqual(1024);
    const source = result.levelMaps!.peak;
    let blockPeak = 0;
    for (let j = 0; j < block; j++) for (let i = 0; i < block; i++) blockPeak = Math.max(blockPeak, source.values[j * source.width + i]!);
    expect(peak.values[0]).toBe(blockPeak);
  });

  it("rejects a truncated payload, naming the length", () => {
    const { bytes } = encodeTiny();
    for (const length of [0, 3, FRAME_PREAMBLE_BYTES - 1, FRAME_PREAMBLE_BYTES, Math.floor(bytes.length / 2), bytes.length - 1]) {
      const decoded = decodeRunPayload(bytes.subarray(0, length));
      expect(decoded.ok, `cut to ${length} bytes`).toBe(false);
      if (!decoded.ok) expect(decoded.path).toMatch(/^payload/);
    }
    const cut = decodeRunPayload(bytes.subarray(0, bytes.length - 1));
    expect(cut).toMatchObject({ ok: false, path: "payload.length", message: expect.stringMatching(/truncated/) });
  });

  it("rejects bytes after the declared end", () => {
    const { bytes } = encodeTiny();
    const longer = new Uint8Array(bytes.length + 1);
    longer.set(bytes);
    expect(decodeRunPayload(longer)).toMatchObject({ ok: false, path: "payload.length" });
  });

  it("rejects a payload with any single bit flipped", () => {
    const { bytes } = encodeTiny();
    const bits = bytes.length * 8;
    // Every bit of the preamble and the first and last bytes of the body, and 150 spread between.
    const positions = new Set<number>();
    for (let bit = 0; bit < (FRAME_PREAMBLE_BYTES + 4) * 8; bit++) positions.add(bit);
    for (let bit = bits - 64; bit < bits; bit++) positions.add(bit);
    for (let n = 0; n < 150; n++) positions.add(Math.floor(((n + 0.5) / 150) * bits));
    for (const bit of positions) {
      const decoded = decodeRunPayload(flipBit(bytes, bit));
      expect(decoded.ok, `bit ${bit} flipped`).toBe(false);
    }
    expect(decodeRunPayload(flipBit(bytes, FRAME_PREAMBLE_BYTES * 8 + 1000))).toMatchObject({ ok: false, path: "payload.crc" });
  });

  it("refuses a declared size beyond the cap before inflating anything", () => {
    const framed = frameWithDeclaredLength(zlibSync(new Uint8Array(64)), MAX_RUN_PAYLOAD_UNCOMPRESSED_BYTES + 1);
    expect(decodeRunPayload(framed)).toMatchObject({ ok: false, path: "payload.length", message: expect.stringMatching(/at most/) });
  });

  it("stops inflating a body that grows past its declared length", () => {
    const { bytes } = encodeTiny();
    const body = bodyOf(bytes);
    // 10 MB of zeros compress to a few kB: declared as 1 kB, it must be refused, not expanded.
    const bomb = frameWithDeclaredLength(zlibSync(new Uint8Array(10_000_000)), 1024);
    expect(decodeRunPayload(bomb)).toMatchObject({ ok: false, path: "payload.body", message: expect.stringMatching(/more than/) });
    const short = frameWithDeclaredLength(zlibSync(body), body.length + 8);
    expect(decodeRunPayload(short)).toMatchObject({ ok: false, path: "payload.body" });
  });

  it("rejects a header that is not JSON, does not fit the schema or disagrees with its sections", () => {
    const notJson = frameBody(new Uint8Array([3, 0, 0, 0, 0x7b, 0x7b, 0x7b, 0]), RUN_PAYLOAD_FORMAT);
    expect(decodeRunPayload(notJson)).toMatchObject({ ok: false, path: "header", message: expect.stringMatching(/JSON/) });
    const { bytes } = encodeTiny();
    const noHash = rewriteHeader(bytes, (header) => {
      header.inputHash = "not-a-hash";
    });
    expect(decodeRunPayload(noHash)).toMatchObject({ ok: false, path: "header.inputHash" });
    const moreReceivers = rewriteHeader(bytes, (header) => {
      (header.receivers as unknown[]).push({ id: "extra", label: "Extra", x: 0, y: 0 });
    });
    expect(decodeRunPayload(moreReceivers)).toMatchObject({ ok: false, path: "header.sections" });
    const wrongFormat = rewriteHeader(bytes, (header) => {
      header.format = 2;
    });
    expect(decodeRunPayload(wrongFormat)).toMatchObject({ ok: false, path: "header.format" });
  });

  it("answers, never throws, for arbitrary bytes", () => {
    let seed = 12345;
    const random = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    for (let n = 0; n < 50; n++) {
      const bytes = new Uint8Array(Math.floor(random() * 400));
      for (let i = 0; i < bytes.length; i++) bytes[i] = Math.floor(random() * 256);
      if (n % 2 === 0 && bytes.length >= 4) bytes.set([0x52, 0x46, 0x52, 0x4e]);
      expect(decodeRunPayload(bytes).ok).toBe(false);
    }
  });

  it("is checked by the server exactly as it is decoded, without the snapshot fields", () => {
    const { bytes } = encodeTiny();
    const checked = checkRunPayload(bytes);
    if (!checked.ok) throw new Error(checked.message);
    expect(checked.run.header).toEqual(decodeOrThrow(bytes).header);
    expect(checked.run.receivers[1]!.pressure).toEqual(tinyRun().result.receivers[1]!.pressure);
    const damaged = [
      bytes.subarray(0, bytes.length - 3),
      flipBit(bytes, 8 * 40),
      rewriteHeader(bytes, (header) => {
        header.receivers = [];
      }),
    ];
    for (const payload of damaged) {
      const decoded = decodeRunPayload(payload);
      expect(decoded.ok).toBe(false);
      expect(checkRunPayload(payload)).toEqual(decoded);
    }
  });

  it("refuses to encode more trace values than the cap, saying what to change", () => {
    const { scene, result } = tinyRun();
    const samples = Math.ceil(MAX_TRACE_VALUES / 3 / 4) + 1;
    const long = new Float32Array(samples);
    const receivers = Array.from({ length: 4 }, (_, r) => ({ ...result.receivers[0]!, id: `r${r}`, pressure: long, velocityX: long, velocityY: long }));
    const encoded = encodeRunPayload({ result: { ...result, stepsRun: samples - 1, receivers }, scene, sceneVersion: 1 });
    expect(encoded).toMatchObject({ ok: false, message: expect.stringMatching(/fewer receivers or a shorter duration/) });
  });
});
