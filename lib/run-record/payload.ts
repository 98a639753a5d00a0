// One binary payload per saved run, written in the browser that ran it and read by the server (to
// check it) and by any browser that shows it. Inside the frame (frame.ts) the body is:
//
//   u32 LE header length | header JSON (header.ts) | zero padding to 4 bytes | sections
//
// Sections, in the order sectionLayout gives, each 4-byte aligned: receiver traces as float32
// (pressure, velocityX, velocityY; receiver after receiver), snapshots as int16 with one scale
// per frame (quantise.ts), the final pressure likewise, level and intensity maps as float32.
// Traces and maps round-trip exactly; snapshots within snapshotErrorBound.
import type { Scene } from "@/lib/fdtd/scene";
import type { FieldSnapshot, LevelMaps, ReceiverTrace, SimulationResult } from "@/lib/fdtd/simulation";
import { readFloat32s, readInt16s, writeFloat32s, writeInt16s } from "./binary";
import { cellStrideForLimit, coarsenField, everyKthFrame, frameStrideForLimit, thinField } from "./decimate";
import { frameBody, unframeBody } from "./frame";
import { alignedBytes, RUN_PAYLOAD_FORMAT, runPayloadHeaderSchema, sectionBytes, sectionLayout, type FieldGeometry, type QuantisedFrame, type RunPayloadHeader, type Section, type SectionName } from "./header";
import { computeRunInputHash } from "./input-hash";
import { MAX_MAP_VALUES, MAX_RUN_HEADER_BYTES, MAX_RUN_PAYLOAD_UNCOMPRESSED_BYTES, MAX_SNAPSHOT_VALUES, MAX_TRACE_VALUES } from "./limits";
import { dequantiseFrame, largestMagnitude, quantisationScale, quantiseFrame } from "./quantise";
import { defaultRunSettings, type RunSettings } from "./settings";
import { SOLVER_VERSION } from "./solver-version";

export { RUN_PAYLOAD_FORMAT, type RunPayloadHeader } from "./header";

export interface RunPayloadInput {
  result: SimulationResult;
  /** The scene as run, after parseScene. */
  scene: Scene;
  /** The saved version of the scene that was run. */
  sceneVersion: number;
  settings?: RunSettings;
  /** Worker threads that stepped the run (recorded, not part of the input: results are bit-identical). */
  threads?: number;
}

/** A saved run read back: the parts of a SimulationResult that are kept, in the same shapes. */
export interface DecodedRun {
  header: RunPayloadHeader;
  receivers: ReceiverTrace[];
  snapshots: FieldSnapshot[];
  finalPressure: FieldSnapshot;
  levelMaps?: LevelMaps;
  intensity?: { x: FieldSnapshot; y: FieldSnapshot; samples: number };
}

export type EncodeRunPayloadOutcome = { ok: true; bytes: Uint8Array<ArrayBuffer>; header: RunPayloadHeader } | { ok: false; message: string };

/** `path` names the part of the payload that is wrong (e.g. "payload.crc", "header.receivers[2].id"). */
export type DecodeRunPayloadOutcome = { ok: true; run: DecodedRun } | { ok: false; path: string; message: string };

function allFinite(values: Float32Array): boolean {
  for (let i = 0; i < values.length; i++) if (!Number.isFinite(values[i]!)) return false;
  return true;
}

function geometryOf(field: FieldSnapshot): FieldGeometry {
  return { width: field.width, height: field.height, x0: field.x0, y0: field.y0, spacing: field.spacing };
}

interface QuantisedField {
  frame: QuantisedFrame;
  values: Int16Array;
}

function quantiseField(field: FieldSnapshot): QuantisedField | undefined {
  const maxAbs = largestMagnitude(field.values);
  if (Number.isNaN(maxAbs)) return undefined;
  const scale = quantisationScale(maxAbs);
  const values = new Int16Array(field.values.length);
  quantiseFrame(field.values, scale, values);
  return { frame: { step: field.step, time: field.time, scale }, values };
}

/** Why a trace cannot be kept, or undefined when every trace can. */
function traceProblem(result: SimulationResult): string | undefined {
  const samples = result.stepsRun + 1;
  for (const trace of result.receivers) {
    if (trace.pressure.length !== samples || trace.velocityX.length !== samples || trace.velocityY.length !== samples) {
      return `receiver "${trace.id}" has ${trace.pressure.length} samples; a run of ${result.stepsRun} steps has ${samples}`;
    }
    if (!allFinite(trace.pressure) || !allFinite(trace.velocityX) || !allFinite(trace.velocityY)) return `receiver "${trace.id}" recorded a value that is not finite`;
  }
  const traceValues = 3 * result.receivers.length * samples;
  if (traceValues > MAX_TRACE_VALUES) {
    return `${result.receivers.length} receivers x ${samples} samples is too much to save (${traceValues} trace values; at most ${MAX_TRACE_VALUES}). Use fewer receivers or a shorter duration.`;
  }
  return undefined;
}

interface KeptFields {
  snapshots: RunPayloadHeader["snapshots"];
  snapshotValues: Int16Array[];
  finalPressure: RunPayloadHeader["finalPressure"];
  finalPressureValues: Int16Array;
}

/** Snapshots thinned to every k-th frame and every s-th cell, each frame on its own scale; the final field likewise. */
function keepFields(result: SimulationResult, settings: RunSettings): KeptFields | string {
  const frameStride = frameStrideForLimit(result.snapshots.length, settings.snapshotFrameLimit);
  const kept = everyKthFrame(result.snapshots, frameStride);
  const first = kept[0];
  const cellStride = first ? cellStrideForLimit(first.width, first.height, settings.snapshotFrameValueLimit) : 1;
  const quantised: QuantisedField[] = [];
  for (const frame of kept) {
    if (frame.width !== first!.width || frame.height !== first!.height) return `snapshot at step ${frame.step} is ${frame.width} x ${frame.height}, unlike the first`;
    const q = quantiseField(thinField(frame, cellStride));
    if (!q) return `snapshot at step ${frame.step} holds a value that is not finite`;
    quantised.push(q);
  }
  const field: FieldGeometry = first ? geometryOf(thinField(first, cellStride)) : { width: 0, height: 0, x0: 0, y0: 0, spacing: result.grid.cellSize };

  const finalStride = cellStrideForLimit(result.finalPressure.width, result.finalPressure.height, settings.snapshotFrameValueLimit);
  const finalThinned = thinField(result.finalPressure, finalStride);
  const final = quantiseField(finalThinned);
  if (!final) return "the final pressure field holds a value that is not finite";
  return {
    snapshots: { frameStride, cellStride, field, frames: quantised.map((q) => q.frame) },
    snapshotValues: quantised.map((q) => q.values),
    finalPressure: { cellStride: finalStride, field: geometryOf(finalThinned), frame: final.frame },
    finalPressureValues: final.values,
  };
}

interface KeptMaps {
  levelMaps?: { header: NonNullable<RunPayloadHeader["levelMaps"]>; peak: Float32Array; rms: Float32Array };
  intensity?: { header: NonNullable<RunPayloadHeader["intensity"]>; x: Float32Array; y: Float32Array };
}

/** Level and intensity maps, coarsened by blocks only when larger than the settings allow. */
function keepMaps(result: SimulationResult, settings: RunSettings): KeptMaps | string {
  const kept: KeptMaps = {};
  if (result.levelMaps) {
    const { peak, rms, samples } = result.levelMaps;
    const block = cellStrideForLimit(peak.width, peak.height, settings.mapValueLimit);
    const coarsePeak = coarsenField(peak, block, "max");
    const coarseRms = coarsenField(rms, block, "rms");
    if (!allFinite(coarsePeak.values) || !allFinite(coarseRms.values)) return "a level map holds a value that is not finite";
    kept.levelMaps = { header: { field: geometryOf(coarsePeak), samples, block }, peak: coarsePeak.values, rms: coarseRms.values };
  }
  if (result.intensity) {
    const { x, y, samples } = result.intensity;
    const block = cellStrideForLimit(x.width, x.height, settings.mapValueLimit);
    const coarseX = coarsenField(x, block, "mean");
    const coarseY = coarsenField(y, block, "mean");
    if (!allFinite(coarseX.values) || !allFinite(coarseY.values)) return "an intensity map holds a value that is not finite";
    kept.intensity = { header: { field: geometryOf(coarseX), samples, block }, x: coarseX.values, y: coarseY.values };
  }
  return kept;
}

/** The header of a run, sections left out (they follow from the rest). */
function headerOf(input: RunPayloadInput, settings: RunSettings, fields: KeptFields, maps: KeptMaps): Omit<RunPayloadHeader, "sections"> {
  const { result, scene } = input;
  const { grid } = result;
  return {
    format: RUN_PAYLOAD_FORMAT,
    solverVersion: SOLVER_VERSION,
    sceneVersion: input.sceneVersion,
    inputHash: computeRunInputHash({ scene, settings }),
    settings,
    scene: scene as unknown as Record<string, unknown>,
    engine: { kernel: result.kernel, threads: input.threads ?? 1 },
    grid: { nx: grid.nx, ny: grid.ny, domainNx: grid.domainCells.nx, domainNy: grid.domainCells.ny, cellSize: grid.cellSize, timeStep: grid.timeStep, plannedSteps: grid.steps },
    run: {
      stepsRun: result.stepsRun,
      simulatedSeconds: result.simulatedSeconds,
      stoppedBy: result.stoppedBy,
      setupSeconds: result.timings.setupSeconds,
      runSeconds: result.timings.runSeconds,
      cellUpdatesPerSecond: result.timings.cellUpdatesPerSecond,
    },
    warnings: result.warnings.map((w) => ({ code: w.code, message: w.message, ...(w.path !== undefined ? { path: w.path } : {}) })),
    sources: result.sources.map((s) => ({ id: s.id, label: s.label, x: s.x, y: s.y })),
    receivers: result.receivers.map((r) => ({ id: r.id, label: r.label, ...(r.lineId !== undefined ? { lineId: r.lineId } : {}), x: r.position.x, y: r.position.y })),
    energy: result.energy.map((e) => ({ step: e.step, time: e.time, joulesPerMetre: e.joulesPerMetre })),
    snapshots: fields.snapshots,
    finalPressure: fields.finalPressure,
    ...(maps.levelMaps ? { levelMaps: maps.levelMaps.header } : {}),
    ...(maps.intensity ? { intensity: maps.intensity.header } : {}),
  };
}

/** Builds the payload of a finished (or cancelled) run; says why when the run cannot be kept. */
export function encodeRunPayload(input: RunPayloadInput): EncodeRunPayloadOutcome {
  const { result } = input;
  const settings = input.settings ?? defaultRunSettings;
  const fail = (message: string): EncodeRunPayloadOutcome => ({ ok: false, message });
  const traces = traceProblem(result);
  if (traces) return fail(traces);
  const fields = keepFields(result, settings);
  if (typeof fields === "string") return fail(fields);
  const maps = keepMaps(result, settings);
  if (typeof maps === "string") return fail(maps);

  const headerWithoutSections = headerOf(input, settings, fields, maps);
  const sections = sectionLayout(headerWithoutSections);
  // What is written must read back: the encoder holds itself to the decoder's schema.
  const checked = runPayloadHeaderSchema.safeParse({ ...headerWithoutSections, sections });
  if (!checked.success) {
    const issue = checked.error.issues[0]!;
    return fail(`the run cannot be saved: ${issue.path.join(".")}: ${issue.message}`);
  }
  const header = checked.data;
  const headerBytes = new TextEncoder().encode(JSON.stringify(header));
  if (headerBytes.length > MAX_RUN_HEADER_BYTES) return fail(`the run's header (scene and figures) is ${headerBytes.length} bytes; at most ${MAX_RUN_HEADER_BYTES} can be saved`);
  const dataStart = alignedBytes(4 + headerBytes.length);
  const bodyLength = dataStart + sectionBytes(sections);
  if (bodyLength > MAX_RUN_PAYLOAD_UNCOMPRESSED_BYTES) return fail(`the run is ${bodyLength} bytes before compression; at most ${MAX_RUN_PAYLOAD_UNCOMPRESSED_BYTES} can be saved`);

  const body = new Uint8Array(bodyLength);
  new DataView(body.buffer).setUint32(0, headerBytes.length, true);
  body.set(headerBytes, 4);
  const at = (name: SectionName) => dataStart + sections.find((s) => s.name === name)!.offset;
  const samples = result.stepsRun + 1;
  result.receivers.forEach((trace, r) => {
    writeFloat32s(body, at("traces.pressure") + 4 * r * samples, trace.pressure);
    writeFloat32s(body, at("traces.velocityX") + 4 * r * samples, trace.velocityX);
    writeFloat32s(body, at("traces.velocityY") + 4 * r * samples, trace.velocityY);
  });
  const frameValues = header.snapshots.field.width * header.snapshots.field.height;
  fields.snapshotValues.forEach((values, f) => writeInt16s(body, at("snapshots") + 2 * f * frameValues, values));
  writeInt16s(body, at("finalPressure"), fields.finalPressureValues);
  if (maps.levelMaps) {
    writeFloat32s(body, at("levelMaps.peak"), maps.levelMaps.peak);
    writeFloat32s(body, at("levelMaps.rms"), maps.levelMaps.rms);
  }
  if (maps.intensity) {
    writeFloat32s(body, at("intensity.x"), maps.intensity.x);
    writeFloat32s(body, at("intensity.y"), maps.intensity.y);
  }
  return { ok: true, bytes: frameBody(body, RUN_PAYLOAD_FORMAT), header };
}

type Failure = { ok: false; path: string; message: string };

function sameSections(actual: readonly Section[], expected: readonly Section[]): boolean {
  return (
    actual.length === expected.length &&
    actual.every((s, i) => {
      const e = expected[i]!;
      return s.name === e.name && s.type === e.type && s.offset === e.offset && s.length === e.length;
    })
  );
}

function formatPath(segments: readonly PropertyKey[]): string {
  return segments.reduce<string>((path, segment) => (typeof segment === "number" ? `${path}[${segment}]` : `${path}.${String(segment)}`), "header");
}

/** Parses and checks the header; every size it implies is checked against the caps and the body. */
function readHeader(body: Uint8Array): { header: RunPayloadHeader; dataStart: number } | Failure {
  const fail = (path: string, message: string): Failure => ({ ok: false, path, message });
  if (body.length < 4) return fail("payload.body", "the body is too short to hold a header length");
  const headerLength = new DataView(body.buffer, body.byteOffset, body.byteLength).getUint32(0, true);
  if (headerLength > MAX_RUN_HEADER_BYTES) return fail("header", `the header is ${headerLength} bytes; at most ${MAX_RUN_HEADER_BYTES} are accepted`);
  if (4 + headerLength > body.length) return fail("header", `the header claims ${headerLength} bytes; the body holds ${body.length - 4}`);
  let json: unknown;
  try {
    json = JSON.parse(new TextDecoder("utf-8", { fatal: true }).decode(body.subarray(4, 4 + headerLength)));
  } catch {
    return fail("header", "the header is not UTF-8 JSON");
  }
  const parsed = runPayloadHeaderSchema.safeParse(json);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    return fail(formatPath(issue.path), issue.message);
  }
  const header = parsed.data;
  const expected = sectionLayout(header);
  if (!sameSections(header.sections, expected)) return fail("header.sections", "the section table does not match what the header describes");
  const length = (name: SectionName) => expected.find((s) => s.name === name)?.length ?? 0;
  if (3 * length("traces.pressure") > MAX_TRACE_VALUES) return fail("header.receivers", `the traces hold more than ${MAX_TRACE_VALUES} values`);
  if (length("snapshots") > MAX_SNAPSHOT_VALUES) return fail("header.snapshots", `the snapshots hold more than ${MAX_SNAPSHOT_VALUES} values`);
  for (const name of ["levelMaps.peak", "intensity.x"] as const) {
    if (length(name) > MAX_MAP_VALUES) return fail(`header.${name.split(".")[0]}`, `a map holds more than ${MAX_MAP_VALUES} values`);
  }
  const dataStart = alignedBytes(4 + headerLength);
  const wanted = dataStart + sectionBytes(expected);
  if (body.length !== wanted) return fail("payload.body", `the body is ${body.length} bytes; its header describes ${wanted}`);

  const { stepsRun } = header.run;
  let previousStep = -1;
  for (const [index, frame] of header.snapshots.frames.entries()) {
    if (frame.step <= previousStep || frame.step > stepsRun) return fail(`header.snapshots.frames[${index}].step`, `snapshot steps must increase and stay within the ${stepsRun} steps run`);
    previousStep = frame.step;
  }
  if (header.finalPressure.frame.step !== stepsRun) return fail("header.finalPressure.frame.step", `the final pressure is at step ${header.finalPressure.frame.step}, not ${stepsRun}`);
  const ids = new Set<string>();
  for (const [index, receiver] of header.receivers.entries()) {
    if (ids.has(receiver.id)) return fail(`header.receivers[${index}].id`, `receiver id "${receiver.id}" appears twice`);
    ids.add(receiver.id);
  }
  return { header, dataStart };
}

function fieldAt(geometry: FieldGeometry, step: number, time: number, values: Float32Array): FieldSnapshot {
  return { step, time, ...geometry, values };
}

interface ReadPayload {
  header: RunPayloadHeader;
  receivers: ReceiverTrace[];
  maps: Pick<DecodedRun, "levelMaps" | "intensity">;
  /** The int16 field sections, read only when the fields are wanted. */
  integers: (name: "snapshots" | "finalPressure") => Int16Array;
}

/** Everything but the snapshot fields: frame, header, traces and maps, each checked. */
function readPayload(bytes: Uint8Array): ReadPayload | Failure {
  const unframed = unframeBody(bytes, RUN_PAYLOAD_FORMAT);
  if (!unframed.ok) return unframed;
  const { body } = unframed;
  const read = readHeader(body);
  if ("ok" in read) return read;
  const { header, dataStart } = read;
  const section = (name: SectionName) => header.sections.find((s) => s.name === name)!;
  const floats = (name: SectionName) => {
    const s = section(name);
    return readFloat32s(body, dataStart + s.offset, s.length);
  };
  const integers = (name: SectionName) => {
    const s = section(name);
    return readInt16s(body, dataStart + s.offset, s.length);
  };

  const { stepsRun, simulatedSeconds } = header.run;
  const samples = stepsRun + 1;
  const pressure = floats("traces.pressure");
  const velocityX = floats("traces.velocityX");
  const velocityY = floats("traces.velocityY");
  if (!allFinite(pressure) || !allFinite(velocityX) || !allFinite(velocityY)) return { ok: false, path: "traces", message: "a receiver trace holds a value that is not finite" };
  const receivers: ReceiverTrace[] = header.receivers.map((receiver, r) => ({
    id: receiver.id,
    label: receiver.label,
    ...(receiver.lineId !== undefined ? { lineId: receiver.lineId } : {}),
    position: { x: receiver.x, y: receiver.y },
    timeStep: header.grid.timeStep,
    pressure: pressure.subarray(r * samples, (r + 1) * samples),
    velocityX: velocityX.subarray(r * samples, (r + 1) * samples),
    velocityY: velocityY.subarray(r * samples, (r + 1) * samples),
  }));

  const maps: ReadPayload["maps"] = {};
  if (header.levelMaps) {
    const peak = floats("levelMaps.peak");
    const rms = floats("levelMaps.rms");
    if (!allFinite(peak) || !allFinite(rms)) return { ok: false, path: "levelMaps", message: "a level map holds a value that is not finite" };
    const { field, samples: mapSamples } = header.levelMaps;
    maps.levelMaps = { peak: fieldAt(field, stepsRun, simulatedSeconds, peak), rms: fieldAt(field, stepsRun, simulatedSeconds, rms), samples: mapSamples };
  }
  if (header.intensity) {
    const x = floats("intensity.x");
    const y = floats("intensity.y");
    if (!allFinite(x) || !allFinite(y)) return { ok: false, path: "intensity", message: "an intensity map holds a value that is not finite" };
    const { field, samples: mapSamples } = header.intensity;
    maps.intensity = { x: fieldAt(field, stepsRun, simulatedSeconds, x), y: fieldAt(field, stepsRun, simulatedSeconds, y), samples: mapSamples };
  }
  return { header, receivers, maps, integers };
}

function decode(bytes: Uint8Array): DecodeRunPayloadOutcome {
  const read = readPayload(bytes);
  if ("ok" in read) return read;
  const { header, receivers, maps, integers } = read;
  // Every int16 is a valid stored value: only the scale turns it into pascals.
  const snapshotValues = integers("snapshots");
  const frameValues = header.snapshots.field.width * header.snapshots.field.height;
  const snapshots = header.snapshots.frames.map((frame, f) =>
    fieldAt(header.snapshots.field, frame.step, frame.time, dequantiseFrame(snapshotValues.subarray(f * frameValues, (f + 1) * frameValues), frame.scale)),
  );
  const final = header.finalPressure;
  const finalPressure = fieldAt(final.field, final.frame.step, final.frame.time, dequantiseFrame(integers("finalPressure"), final.frame.scale));
  return { ok: true, run: { header, receivers, snapshots, finalPressure, ...maps } };
}

/** A path above that failed to foresee some input: still an answer, never an exception. */
function unforeseen(error: unknown): Failure {
  return { ok: false, path: "payload", message: `the payload could not be read (${error instanceof Error ? error.message : "unknown error"})` };
}

/**
 * Reads a payload back. Anything malformed (truncated, damaged, oversized, inconsistent) gives
 * { ok: false } naming what is wrong; it never throws and never returns part of a run.
 */
export function decodeRunPayload(bytes: Uint8Array): DecodeRunPayloadOutcome {
  try {
    return decode(bytes);
  } catch (error) {
    return unforeseen(error);
  }
}

/** What a server needs of an upload: the checked header and the traces (for the summary). */
export interface CheckedRunPayload {
  header: RunPayloadHeader;
  receivers: ReceiverTrace[];
}

/**
 * Checks a payload as thoroughly as decodeRunPayload (any payload one accepts, the other accepts)
 * without turning the snapshots into float32 fields, which would double the memory an upload takes.
 */
export function checkRunPayload(bytes: Uint8Array): { ok: true; run: CheckedRunPayload } | Failure {
  try {
    const read = readPayload(bytes);
    if ("ok" in read) return read;
    return { ok: true, run: { header: read.header, receivers: read.receivers } };
  } catch (error) {
    return unforeseen(error);
  }
}
