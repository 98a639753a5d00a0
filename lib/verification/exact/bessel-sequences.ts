/**
 * Bessel functions J_nu(x), Y_nu(x) for the runs of orders nu = nu0, nu0 + 1, nu0 + 2, ... with nu0 = 0
 * (integer orders) or nu0 = 1/2 (half-integer orders), x > 0.
 *
 * Starting values: integer orders take J0, J1, Y0, Y1 from the `bessel` package; half-integer orders are
 * elementary, J_{1/2} = sqrt(2/(pi x)) sin x, J_{3/2} = sqrt(2/(pi x)) (sin x / x - cos x),
 * Y_{1/2} = -sqrt(2/(pi x)) cos x, Y_{3/2} = -sqrt(2/(pi x)) (cos x / x + sin x) (A&S 10.1.1, 10.1.11, 10.1.12).
 * Recurrence (A&S 9.1.27): C_{nu-1} + C_{nu+1} = (2 nu / x) C_nu for C = J, Y.
 * Y grows with order, so upward recurrence is stable for it. J decays once nu > x, so it is run upward only
 * while nu < x and continued with ratios J_nu / J_{nu-1} from Miller's downward recurrence
 * (A&S 9.12, numerical methods; no zeros of J_nu(x) lie at nu >= x, so those ratios are finite).
 */
import { besselJ, besselY } from "./hankel";

export type OrderRun = "integer" | "halfInteger";

function firstOrder(run: OrderRun): number {
  return run === "integer" ? 0 : 0.5;
}

/**
 * Fills out[m] = J_{nu0 + m}(x) / J_{nu0 + m - 1}(x) for m >= 1 (out[0] is left at 0) by Miller's backward
 * recurrence rho_m = 1 / (2 (nu0 + m) / x - rho_{m+1}), started with rho = 0 far above the last order.
 * Exact ratios of the minimal solution; finite wherever nu0 + m - 1 >= x (no zeros of J there).
 */
export function besselJRatioRun(run: OrderRun, x: number, out: Float64Array): void {
  if (!(x > 0)) throw new RangeError(`besselJRatioRun needs x > 0, got ${x}`);
  const count = out.length;
  const nu0 = firstOrder(run);
  const top = count + 20 + Math.ceil(Math.sqrt(40 * count) + x);
  let rho = 0;
  for (let m = top; m >= 1; m--) {
    rho = 1 / ((2 * (nu0 + m)) / x - rho);
    if (m < count) out[m] = rho;
  }
}

/**
 * Fills out[m] = J_{nu0 + m}(x) for m = 0 .. out.length - 1 (nu0 = 0 or 1/2). Values below the smallest
 * double underflow to 0.
 */
export function besselJRun(run: OrderRun, x: number, out: Float64Array): void {
  if (!(x > 0)) throw new RangeError(`besselJRun needs x > 0, got ${x}`);
  const count = out.length;
  if (count === 0) return;
  const nu0 = firstOrder(run);
  let j0: number;
  let j1: number;
  if (run === "integer") {
    j0 = besselJ(0, x);
    j1 = besselJ(1, x);
  } else {
    const amplitude = Math.sqrt(2 / (Math.PI * x));
    j0 = amplitude * Math.sin(x);
    j1 = amplitude * (Math.sin(x) / x - Math.cos(x));
  }
  out[0] = j0;
  if (count === 1) return;
  out[1] = j1;
  // Upward while the order is below x (the recurrence is stable there).
  let last = 1;
  while (last + 1 < count && nu0 + last < x) {
    const order = nu0 + last;
    out[last + 1] = ((2 * order) / x) * (out[last] ?? 0) - (out[last - 1] ?? 0);
    last++;
  }
  if (last + 1 >= count) return;
  // Beyond: J_{nu0+m} = J_{nu0+m-1} * rho_m (order nu0 + last >= x, so J there is not at a zero).
  const ratios = new Float64Array(count);
  besselJRatioRun(run, x, ratios);
  for (let m = last + 1; m < count; m++) out[m] = (out[m - 1] ?? 0) * (ratios[m] ?? 0);
}

/** Fills out[m] = Y_{nu0 + m}(x) by upward recurrence; overflows to -Infinity at very high orders. */
export function besselYRun(run: OrderRun, x: number, out: Float64Array): void {
  if (!(x > 0)) throw new RangeError(`besselYRun needs x > 0, got ${x}`);
  const count = out.length;
  if (count === 0) return;
  const nu0 = firstOrder(run);
  if (run === "integer") {
    out[0] = besselY(0, x);
    if (count > 1) out[1] = besselY(1, x);
  } else {
    const amplitude = Math.sqrt(2 / (Math.PI * x));
    out[0] = -amplitude * Math.cos(x);
    if (count > 1) out[1] = -amplitude * (Math.cos(x) / x + Math.sin(x));
  }
  for (let m = 1; m + 1 < count; m++) out[m + 1] = ((2 * (nu0 + m)) / x) * (out[m] ?? 0) - (out[m - 1] ?? 0);
}
