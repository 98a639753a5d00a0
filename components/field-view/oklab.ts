// OKLab, the perceptual colour space the field view's colour scales are designed in.
// Definition: Björn Ottosson, "A perceptual color space for image processing" (2020), the
// linear-sRGB <-> LMS <-> OKLab matrices with a cube-root non-linearity. sRGB transfer function:
// IEC 61966-2-1:1999. Pure functions; colours are plain tuples so a whole scale fits in a loop.

/** Non-linear sRGB channels in [0, 1] (what a CSS hex colour holds). */
export type Rgb = readonly [r: number, g: number, b: number];

/** OKLab: L lightness in [0, 1], a green-red, b blue-yellow (about -0.4 .. 0.4 for sRGB colours). */
export type OkLab = readonly [L: number, a: number, b: number];

/** IEC 61966-2-1 decoding: non-linear sRGB channel -> linear light. */
export function srgbToLinear(channel: number): number {
  return channel <= 0.04045 ? channel / 12.92 : Math.pow((channel + 0.055) / 1.055, 2.4);
}

/** IEC 61966-2-1 encoding: linear light -> non-linear sRGB channel. */
export function linearToSrgb(channel: number): number {
  return channel <= 0.0031308 ? 12.92 * channel : 1.055 * Math.pow(channel, 1 / 2.4) - 0.055;
}

/** Non-linear sRGB -> OKLab (Ottosson 2020). */
export function srgbToOkLab([red, green, blue]: Rgb): OkLab {
  return linearSrgbToOkLab(srgbToLinear(red), srgbToLinear(green), srgbToLinear(blue));
}

/** Linear-light sRGB (any real values, also outside [0, 1]) -> OKLab: Ottosson's M1 (via LMS), cube root, M2. */
export function linearSrgbToOkLab(r: number, g: number, b: number): OkLab {
  const l = Math.cbrt(0.4122214708 * r + 0.5363325363 * g + 0.0514459929 * b);
  const m = Math.cbrt(0.2119034982 * r + 0.6806995451 * g + 0.1073969566 * b);
  const s = Math.cbrt(0.0883024619 * r + 0.2817188376 * g + 0.6299787005 * b);
  return [
    0.2104542553 * l + 0.793617785 * m - 0.0040720468 * s,
    1.9779984951 * l - 2.428592205 * m + 0.4505937099 * s,
    0.0259040371 * l + 0.7827717662 * m - 0.808675766 * s,
  ];
}

/** OKLab -> non-linear sRGB, unclamped: a channel outside [0, 1] means the colour is out of the sRGB gamut. */
export function okLabToSrgb([L, a, b]: OkLab): Rgb {
  const l = Math.pow(L + 0.3963377774 * a + 0.2158037573 * b, 3);
  const m = Math.pow(L - 0.1055613458 * a - 0.0638541728 * b, 3);
  const s = Math.pow(L - 0.0894841775 * a - 1.291485548 * b, 3);
  return [
    linearToSrgbSigned(4.0767416621 * l - 3.3077115913 * m + 0.2309699292 * s),
    linearToSrgbSigned(-1.2684380046 * l + 2.6097574011 * m - 0.3413193965 * s),
    linearToSrgbSigned(-0.0041960863 * l - 0.7034186147 * m + 1.707614701 * s),
  ];
}

// Keeps the sign of an out-of-gamut negative channel so a gamut check can see it.
function linearToSrgbSigned(channel: number): number {
  return channel < 0 ? -linearToSrgb(-channel) : linearToSrgb(channel);
}

/** OKLab from polar form: lightness, chroma and hue angle in degrees. */
export function okLchToOkLab(L: number, chroma: number, hueDegrees: number): OkLab {
  const h = (hueDegrees * Math.PI) / 180;
  return [L, chroma * Math.cos(h), chroma * Math.sin(h)];
}

/** Hue angle of an OKLab colour, degrees in [0, 360). */
export function okLabHue([, a, b]: OkLab): number {
  const degrees = (Math.atan2(b, a) * 180) / Math.PI;
  return degrees < 0 ? degrees + 360 : degrees;
}

/** Euclidean distance in OKLab: Ottosson's space is built so that it tracks perceived difference. */
export function okLabDistance(p: OkLab, q: OkLab): number {
  return Math.hypot(p[0] - q[0], p[1] - q[1], p[2] - q[2]);
}

/** "#rrggbb" -> sRGB channels in [0, 1]. */
export function hexToRgb(hex: string): Rgb {
  const match = /^#([0-9a-f]{6})$/i.exec(hex);
  if (!match) throw new Error(`expected a colour as #rrggbb, got "${hex}"`);
  const value = Number.parseInt(match[1]!, 16);
  return [((value >> 16) & 255) / 255, ((value >> 8) & 255) / 255, (value & 255) / 255];
}

/** sRGB channels -> "#rrggbb", clamped to the gamut. */
export function rgbToHex(rgb: Rgb): string {
  return `#${rgb.map((c) => toByte(c).toString(16).padStart(2, "0")).join("")}`;
}

/** A channel in [0, 1] -> 0..255, clamped and rounded. */
export function toByte(channel: number): number {
  return Math.round(Math.min(1, Math.max(0, channel)) * 255);
}
