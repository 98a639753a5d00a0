// How the field view writes numbers: pressures with an SI prefix, levels to 0.1 dB, positions in metres,
// tick labels with just the decimals their step needs, and a true minus sign throughout.
import { decimalsForStep } from "./view-layout";

const MINUS = "\u2212";

/** Replaces a leading hyphen-minus with the typographic minus sign. */
function withMinus(text: string): string {
  return text.startsWith("-") ? MINUS + text.slice(1) : text;
}

/** The pressure unit that keeps values of magnitude up to `maxAbs` Pa readable: Pa, mPa or uPa, and its factor. */
export function pressureUnitFor(maxAbs: number): { unit: "Pa" | "mPa" | "\u00b5Pa"; factor: number } {
  if (maxAbs >= 1) return { unit: "Pa", factor: 1 };
  if (maxAbs >= 1e-3) return { unit: "mPa", factor: 1e3 };
  return { unit: "\u00b5Pa", factor: 1e6 };
}

/** A pressure to 3 significant figures with a fitting SI prefix, e.g. "\u221212.3 mPa". */
export function formatPressure(pressure: number): string {
  if (pressure === 0) return "0 Pa";
  if (!Number.isFinite(pressure)) return "\u2014";
  const { unit, factor } = pressureUnitFor(Math.abs(pressure));
  return `${withMinus((pressure * factor).toPrecision(3))} ${unit}`;
}

/** A level to 0.1 dB; an em dash for a silent cell (at or below `floorDb`). */
export function formatLevel(level: number, floorDb: number): string {
  if (!Number.isFinite(level) || level <= floorDb) return "\u2014";
  return `${withMinus(level.toFixed(1))} dB`;
}

/** A signed level difference to 0.1 dB, e.g. "+6.2 dB". */
export function formatLevelDifference(difference: number): string {
  if (!Number.isFinite(difference)) return "\u2014";
  const text = difference.toFixed(1);
  return `${Number(text) > 0 ? "+" : ""}${withMinus(text === "-0.0" ? "0.0" : text)} dB`;
}

/** A position in metres to the centimetre. */
export function formatMetres(metres: number): string {
  return `${withMinus(metres.toFixed(2))} m`;
}

/** A simulated time in milliseconds, e.g. "12.35 ms". */
export function formatMilliseconds(seconds: number): string {
  return `${withMinus((seconds * 1e3).toFixed(2))} ms`;
}

/** A tick label: as many decimals as the tick step needs, an explicit "+" when `signed` and positive. */
export function formatTick(value: number, step: number, signed = false): string {
  const decimals = decimalsForStep(step);
  const rounded = Number(value.toFixed(decimals));
  const text = (rounded === 0 ? 0 : rounded).toFixed(decimals);
  return `${signed && rounded > 0 ? "+" : ""}${withMinus(text)}`;
}
