// One colour per frequency band for the sweep charts: low bands deep teal, high bands ember, the hue
// turned evenly in OKLCh so that neighbouring bands stay apart and none is much lighter than another.
import { okLabToSrgb, okLchToOkLab, rgbToHex } from "@/components/field-view/oklab";

const LOW_HUE = 215;
const HIGH_HUE = 35;

/** Colour of band `index` of `count`, as "#rrggbb". */
export function bandColour(index: number, count: number): string {
  const t = count <= 1 ? 0 : index / (count - 1);
  // Lightness dips slightly in the middle: the greens and yellows there look brighter at equal L.
  const lightness = 0.56 - 0.06 * Math.sin(Math.PI * t);
  return rgbToHex(okLabToSrgb(okLchToOkLab(lightness, 0.13, LOW_HUE + (HIGH_HUE - LOW_HUE) * t)));
}
