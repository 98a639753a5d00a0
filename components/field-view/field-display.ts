// What the field view shows in each mode: which grid of values, the colour range and scale, the colour
// bar's quantity and unit, the caption, and the read-out under the cursor. Pure, so the component only
// wires it to the canvases and the modes can be tested without a browser.
import type { FieldSnapshot, LevelMaps } from "@/lib/fdtd/simulation";

import { LEVEL_DIFFERENCE_SCALE, LEVEL_SCALE, PRESSURE_SCALE, type ColourScale } from "./colour-scales";
import type { ColourBarSpec } from "./field-overlay";
import { formatLevel, formatLevelDifference, formatMetres, formatMilliseconds, formatPressure, pressureUnitFor } from "./format";
import { autoDifferenceRange, autoLevelRange, autoSymmetricRange, LEVEL_FLOOR_DB, sampleField, soundPressureLevel } from "./levels";

export type FieldViewMode = "pressure" | "peak-level" | "rms-level" | "level-difference";

/**
 * The colour range. Automatic, or fixed: `maxAbs` (symmetric about zero) for pressure, Pa, and for the
 * level difference, dB; `min`/`max` for peak and RMS levels, dB re 20 uPa. A fixed range of the wrong
 * shape for the mode is treated as automatic.
 */
export type FieldRange = { kind: "auto" } | { kind: "fixed"; maxAbs: number } | { kind: "fixed"; min: number; max: number };

export interface FieldDisplay {
  mode: FieldViewMode;
  /** The values drawn: Pa, dB re 20 uPa, or dB of difference. */
  values: FieldSnapshot;
  /** Values at the low and high ends of the scale, in the units of `values`. */
  low: number;
  high: number;
  scale: ColourScale;
  colourBar: ColourBarSpec;
  title: string;
  detail: string;
}

export type DisplayResult = { kind: "ready"; display: FieldDisplay } | { kind: "empty"; title: string; message: string };

/** Shown when an automatic pressure range finds nothing but zeros (before the wave starts), Pa. */
export const QUIET_FIELD_RANGE = 1e-3;

function fixedMaxAbs(range: FieldRange): number | undefined {
  return range.kind === "fixed" && "maxAbs" in range && range.maxAbs > 0 ? range.maxAbs : undefined;
}

function fixedMinMax(range: FieldRange): { min: number; max: number } | undefined {
  return range.kind === "fixed" && "min" in range && range.max > range.min ? { min: range.min, max: range.max } : undefined;
}

/** Signed pressure, symmetric range, colour bar in Pa, mPa or uPa to suit the range. */
export function pressureDisplay(field: FieldSnapshot, range: FieldRange, scratch: Uint32Array): FieldDisplay {
  const maxAbs = fixedMaxAbs(range) ?? autoSymmetricRange(field.values, scratch) ?? QUIET_FIELD_RANGE;
  const { unit, factor } = pressureUnitFor(maxAbs);
  return {
    mode: "pressure",
    values: field,
    low: -maxAbs,
    high: maxAbs,
    scale: PRESSURE_SCALE,
    colourBar: { scale: PRESSURE_SCALE, low: -maxAbs * factor, high: maxAbs * factor, unit, quantity: "Pressure", signed: true },
    title: "Sound pressure",
    detail: `t = ${formatMilliseconds(field.time)} \u00b7 step ${field.step.toLocaleString("en-GB")}`,
  };
}

/** A peak or RMS level map (values already in dB re 20 uPa). */
export function levelDisplay(levels: FieldSnapshot, kind: "peak" | "rms", samples: number, timeStep: number, range: FieldRange, scratch: Uint32Array): FieldDisplay {
  const span = fixedMinMax(range) ?? autoLevelRange(levels.values, scratch) ?? { min: 0, max: 100 };
  return {
    mode: kind === "peak" ? "peak-level" : "rms-level",
    values: levels,
    low: span.min,
    high: span.max,
    scale: LEVEL_SCALE,
    colourBar: { scale: LEVEL_SCALE, low: span.min, high: span.max, unit: "dB re 20 \u00b5Pa", quantity: kind === "peak" ? "Peak level" : "RMS level", signed: false },
    title: kind === "peak" ? "Peak sound pressure level" : "RMS sound pressure level",
    detail: `over ${formatMilliseconds(samples * timeStep)} \u00b7 ${samples.toLocaleString("en-GB")} steps`,
  };
}

/** Insertion-loss map (reference minus variant, dB), symmetric range. */
export function differenceDisplay(difference: FieldSnapshot, kind: "peak" | "rms", range: FieldRange, scratch: Uint32Array): FieldDisplay {
  const maxAbs = fixedMaxAbs(range) ?? autoDifferenceRange(difference.values, scratch);
  return {
    mode: "level-difference",
    values: difference,
    low: -maxAbs,
    high: maxAbs,
    scale: LEVEL_DIFFERENCE_SCALE,
    colourBar: { scale: LEVEL_DIFFERENCE_SCALE, low: -maxAbs, high: maxAbs, unit: "dB, ref \u2212 this", quantity: "\u0394L", signed: true },
    title: `Level difference (insertion loss), ${kind === "peak" ? "peak" : "RMS"}`,
    detail: "reference run minus this run; positive where this run is quieter",
  };
}

/** The message shown when a mode has nothing to draw. */
export function emptyDisplay(mode: FieldViewMode, problem?: string): DisplayResult {
  switch (mode) {
    case "pressure":
      return { kind: "empty", title: "Sound pressure", message: problem ?? "No pressure field yet: run the scene to see the wave." };
    case "peak-level":
    case "rms-level":
      return { kind: "empty", title: mode === "peak-level" ? "Peak sound pressure level" : "RMS sound pressure level", message: problem ?? "This run kept no level maps." };
    case "level-difference":
      return { kind: "empty", title: "Level difference (insertion loss)", message: problem ?? "Choose a reference run to compare this one with." };
  }
}

/** One labelled value of the hover read-out. */
export interface ReadoutItem {
  label: string;
  value: string;
}

export interface ReadoutSources {
  mode: FieldViewMode;
  field: FieldSnapshot | null;
  levelMaps?: LevelMaps;
  comparison?: LevelMaps;
  differenceOf: "peak" | "rms";
}

/** Position, pressure and level under scene point (x, y) m, for the status line. */
export function readoutAt(sources: ReadoutSources, x: number, y: number): ReadoutItem[] {
  const items: ReadoutItem[] = [
    { label: "x", value: formatMetres(x) },
    { label: "y", value: formatMetres(y) },
  ];
  const level = (p: number | undefined) => (p === undefined ? "\u2014" : formatLevel(soundPressureLevel(p), LEVEL_FLOOR_DB));
  const pressure = (p: number | undefined) => (p === undefined ? "\u2014" : formatPressure(p));
  switch (sources.mode) {
    case "pressure": {
      const p = sources.field ? sampleField(sources.field, x, y) : undefined;
      items.push({ label: "p", value: pressure(p) }, { label: "level", value: level(p) });
      break;
    }
    case "peak-level":
    case "rms-level": {
      const map = sources.mode === "peak-level" ? sources.levelMaps?.peak : sources.levelMaps?.rms;
      const p = map ? sampleField(map, x, y) : undefined;
      const name = sources.mode === "peak-level" ? "peak" : "RMS";
      items.push({ label: `L ${name}`, value: level(p) }, { label: `p ${name}`, value: pressure(p) });
      break;
    }
    case "level-difference": {
      const pick = (maps?: LevelMaps) => (maps ? (sources.differenceOf === "peak" ? maps.peak : maps.rms) : undefined);
      const reference = pick(sources.comparison);
      const variant = pick(sources.levelMaps);
      const pRef = reference ? sampleField(reference, x, y) : undefined;
      const pVar = variant ? sampleField(variant, x, y) : undefined;
      const difference =
        pRef === undefined || pVar === undefined
          ? "\u2014"
          : formatLevelDifference(Math.max(soundPressureLevel(pRef), LEVEL_FLOOR_DB) - Math.max(soundPressureLevel(pVar), LEVEL_FLOOR_DB));
      items.push({ label: "\u0394L", value: difference }, { label: "L ref", value: level(pRef) }, { label: "L this", value: level(pVar) });
      break;
    }
  }
  return items;
}
