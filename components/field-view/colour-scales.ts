// Rarefact's own colour scales for fields, designed in OKLab (see oklab.ts):
// - "tide–ember", diverging, for signed pressure: rarefaction in the house teal, compression in the
//   house ember, zero near-white; symmetric in lightness about zero.
// - "night–straw", sequential, for levels in dB: lightness rises steadily from deep night blue through
//   the teal and a sage green to a pale straw, so louder is always lighter.
// Each scale is a path through OKLab between hand-chosen anchors, resampled at equal OKLab arc length so
// that neighbouring entries differ by the same perceived amount, then stored as a 256-entry RGBA table.
import { hexToRgb, okLabToSrgb, okLabDistance, okLabHue, okLchToOkLab, rgbToHex, srgbToOkLab, toByte, type OkLab } from "./oklab";

/** Entries in every lookup table: index 0 is the low end, 255 the high end. */
export const LUT_SIZE = 256;

export interface ColourScale {
  id: "tide-ember" | "tide-ember-reversed" | "night-straw";
  /** How the scale reads, for the legend's title attribute and screen readers. */
  description: string;
  kind: "diverging" | "sequential";
  /** LUT_SIZE RGBA entries, opaque. */
  lut: Uint8Array;
  /** The same entries before rounding to bytes, OKLab. */
  okLab: readonly OkLab[];
  /** A few stops for CSS gradients (the colour bar in HTML, swatches), offset 0 = low end. */
  gradientStops: readonly { offset: number; colour: string }[];
}

/** One anchor of a scale's path: OKLab lightness, chroma and hue (degrees). */
interface Anchor {
  L: number;
  chroma: number;
  hue: number;
}

// Hues taken from the house palette (app/globals.css) so the field reads as part of the product:
// tide-500 #1f8f8a and ember-500 #d65a2c.
const TIDE_HUE = okLabHue(srgbToOkLab(hexToRgb("#1f8f8a")));
const EMBER_HUE = okLabHue(srgbToOkLab(hexToRgb("#d65a2c")));

// The two halves of the diverging scale share their lightness at every anchor, so equal |p| of either sign
// sits at equal lightness; chroma is each hue's own, kept inside the sRGB gamut (checked in the tests).
// The centre has no chroma, so the hue switch at zero is seamless.
const DIVERGING_LIGHTNESS = [0.975, 0.83, 0.64, 0.42] as const;
const RAREFACTION_HALF: Anchor[] = DIVERGING_LIGHTNESS.map((L, k) => ({ L, chroma: [0, 0.06, 0.098, 0.066][k]!, hue: TIDE_HUE }));
const COMPRESSION_HALF: Anchor[] = DIVERGING_LIGHTNESS.map((L, k) => ({ L, chroma: [0, 0.07, 0.145, 0.13][k]!, hue: EMBER_HUE }));

// Levels: night blue (the header colour) -> tide teal -> sage -> straw cream; lightness always rising, and
// the chroma kept moderate so the scene drawn on top stays the strongest thing in the picture.
const LEVEL_PATH: Anchor[] = [
  { L: 0.23, chroma: 0.04, hue: 245 },
  { L: 0.44, chroma: 0.075, hue: 215 },
  { L: 0.63, chroma: 0.1, hue: 185 },
  { L: 0.81, chroma: 0.085, hue: 135 },
  { L: 0.955, chroma: 0.055, hue: 92 },
];

function anchorToOkLab(anchor: Anchor): OkLab {
  return okLchToOkLab(anchor.L, anchor.chroma, anchor.hue);
}

/** Point at parameter u in [0, 1] on the polyline through `points`, anchors equally spaced in u. */
function pointOnPath(points: readonly OkLab[], u: number): OkLab {
  const segments = points.length - 1;
  const x = Math.min(Math.max(u, 0), 1) * segments;
  const k = Math.min(Math.floor(x), segments - 1);
  const f = x - k;
  const p = points[k]!;
  const q = points[k + 1]!;
  return [p[0] + (q[0] - p[0]) * f, p[1] + (q[1] - p[1]) * f, p[2] + (q[2] - p[2]) * f];
}

/**
 * Parameters u_0 = 0 .. u_{count-1} = 1 that cut the given paths (walked together, same u) into steps of
 * equal mean OKLab arc length. With one path this is plain arc-length resampling; with the two halves of
 * the diverging scale it keeps them at the same u (hence the same lightness) while evening out the steps.
 */
function equalArcLengthParameters(paths: readonly (readonly OkLab[])[], count: number): number[] {
  const fine = 4096;
  const cumulative = new Float64Array(fine + 1);
  let previous = paths.map((path) => pointOnPath(path, 0));
  for (let k = 1; k <= fine; k++) {
    const current = paths.map((path) => pointOnPath(path, k / fine));
    let step = 0;
    for (let p = 0; p < paths.length; p++) step += okLabDistance(previous[p]!, current[p]!);
    cumulative[k] = cumulative[k - 1]! + step / paths.length;
    previous = current;
  }
  const total = cumulative[fine]!;
  const parameters: number[] = [];
  let k = 0;
  for (let n = 0; n < count; n++) {
    const target = (total * n) / (count - 1);
    while (k < fine - 1 && cumulative[k + 1]! < target) k++;
    const span = cumulative[k + 1]! - cumulative[k]!;
    const f = span > 0 ? Math.min(1, Math.max(0, (target - cumulative[k]!) / span)) : 0;
    parameters.push((k + f) / fine);
  }
  return parameters;
}

function packLut(colours: readonly OkLab[]): Uint8Array {
  const lut = new Uint8Array(colours.length * 4);
  colours.forEach((colour, i) => {
    const rgb = okLabToSrgb(colour);
    lut[4 * i] = toByte(rgb[0]);
    lut[4 * i + 1] = toByte(rgb[1]);
    lut[4 * i + 2] = toByte(rgb[2]);
    lut[4 * i + 3] = 255;
  });
  return lut;
}

function gradientStopsOf(colours: readonly OkLab[], stops = 17): { offset: number; colour: string }[] {
  return Array.from({ length: stops }, (_, k) => {
    const index = Math.round((k * (colours.length - 1)) / (stops - 1));
    return { offset: index / (colours.length - 1), colour: rgbToHex(okLabToSrgb(colours[index]!)) };
  });
}

function buildDiverging(): OkLab[] {
  const rarefaction = RAREFACTION_HALF.map(anchorToOkLab);
  const compression = COMPRESSION_HALF.map(anchorToOkLab);
  // Entry i stands for t_i = (i - 127.5) / 127.5 in [-1, 1]; its half is walked to |t_i|, so entries
  // i and 255 - i are the same distance from zero on either side.
  const half = LUT_SIZE / 2;
  const parameters = equalArcLengthParameters([rarefaction, compression], 2049);
  const atDistance = (distance: number) => parameters[Math.round(distance * (parameters.length - 1))]!;
  const colours: OkLab[] = [];
  for (let i = 0; i < LUT_SIZE; i++) {
    const t = (i - (half - 0.5)) / (half - 0.5);
    const u = atDistance(Math.abs(t));
    colours.push(pointOnPath(t < 0 ? rarefaction : compression, u));
  }
  return colours;
}

function buildSequential(anchors: readonly Anchor[]): OkLab[] {
  const path = anchors.map(anchorToOkLab);
  return equalArcLengthParameters([path], LUT_SIZE).map((u) => pointOnPath(path, u));
}

function makeScale(id: ColourScale["id"], kind: ColourScale["kind"], description: string, colours: OkLab[]): ColourScale {
  return { id, kind, description, okLab: colours, lut: packLut(colours), gradientStops: gradientStopsOf(colours) };
}

/** Signed pressure: teal rarefaction (low end) .. near-white zero .. ember compression (high end). */
export const PRESSURE_SCALE: ColourScale = makeScale(
  "tide-ember",
  "diverging",
  "teal for rarefaction (p < 0), near-white at zero, ember for compression (p > 0)",
  buildDiverging(),
);

/**
 * Level difference (insertion loss, reference minus variant): the same scale turned round, so that a
 * quieter variant (positive insertion loss) reads teal and a louder one ember, the house warning colour.
 */
export const LEVEL_DIFFERENCE_SCALE: ColourScale = makeScale(
  "tide-ember-reversed",
  "diverging",
  "ember where the variant is louder than the reference, near-white for no change, teal where it is quieter",
  [...PRESSURE_SCALE.okLab].reverse(),
);

/** Levels in dB: dark night blue for quiet, rising through teal to pale straw for loud. */
export const LEVEL_SCALE: ColourScale = makeScale("night-straw", "sequential", "dark blue for quiet, through teal and sage, to pale straw for loud", buildSequential(LEVEL_PATH));

/** A CSS linear-gradient of a scale, low end first along `direction` (e.g. "to top"). */
export function cssGradient(scale: ColourScale, direction = "to right"): string {
  return `linear-gradient(${direction}, ${scale.gradientStops.map((s) => `${s.colour} ${(s.offset * 100).toFixed(1)}%`).join(", ")})`;
}
