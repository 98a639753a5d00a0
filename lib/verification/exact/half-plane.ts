/**
 * Exact field of a coherent line source parallel to the edge of a thin rigid (Neumann) half-plane, in the
 * frequency domain (time factor e^{-i omega t}; see ./hankel.ts). Positions are polar about the edge: the
 * screen is the ray angle = 0 (its upper face) = 2 pi (its lower face), the open region is 0 < angle < 2 pi.
 *
 * The total field G solves (lap + k^2) G = -delta(x - x0) with dG/dn = 0 on both faces and is outgoing.
 * Eigenfunction series (Macdonald, Proc. London Math. Soc., 1915; Bowman, Senior & Uslenghi, Electromagnetic
 * and Acoustic Scattering by Simple Shapes, 1969, chapters on the wedge and the half-plane, chapter numbers
 * not checked; here the wedge series with exterior angle 2 pi):
 *
 *   G = (i/4) sum_{n>=0} eps_n J_{n/2}(k r<) H^(1)_{n/2}(k r>) cos(n theta / 2) cos(n theta0 / 2),
 *   eps_0 = 1, eps_n = 2.
 *
 * (Each radial factor (i pi / 2) J_nu(k r<) H_nu(k r>) jumps in slope by -1/r0 at r = r0, by the Wronskian
 * J_nu H_nu' - J_nu' H_nu = 2i/(pi x), A&S 9.1.16; the angular functions sqrt(eps_n / 2 pi) cos(n theta/2)
 * are orthonormal on (0, 2 pi) with zero slope at both faces.) The series converges like (r< / r>)^{n/2},
 * so it is slow when source and receiver are at similar distances from the edge, and fails when they are equal.
 *
 * The default route is an integral form, valid for every geometry. With cos(n theta/2) cos(n theta0/2) =
 * (cos(n psi-/2) + cos(n psi+/2)) / 2, psi-+ = theta -+ theta0, insert the representation below. It follows
 * from Graf's addition theorem (A&S 9.1.79: J_m H_m is the m-th Fourier coefficient of H0(k R(phi))) continued
 * to non-integer order by the contour argument behind Schlaefli's integral for J_nu (A&S 9.1.22); it was
 * derived for this module and checked numerically (mpmath, and against the series in the tests):
 *
 *   J_nu(k r<) H_nu(k r>) = (1/pi) int_0^pi H0(k R(phi)) cos(nu phi) dphi
 *                           - (sin(nu pi)/pi) int_0^inf H0(k Rz(zeta)) e^{-nu zeta} dzeta,
 *   R(phi)^2 = r^2 + r0^2 - 2 r r0 cos(phi),   Rz(zeta)^2 = r^2 + r0^2 + 2 r r0 cosh(zeta),
 *
 * and sum the orders in closed form (sum_n eps_n cos(n x/2) is a Dirac comb of period 4 pi;
 * sum_{n>=1} e^{-n b} sin(n a) = sin a / (2 (cosh b - cos a))). The result is the direct and image waves
 * where they are geometrically visible, plus an edge-diffracted integral:
 *
 *   G = (i/4) [chi(psi-) H0(k R(psi-)) + chi(psi+) H0(k R(psi+))] - (i/(8 pi)) int_0^inf H0(k Rz) K dzeta,
 *   K(zeta) = sum over a in {(pi +- psi-)/2, (pi +- psi+)/2} of sin a / (2 (cosh(zeta/2) - cos a)),
 *
 * with chi(psi) = 1 where |psi| < pi (psi taken modulo 4 pi into (-2 pi, 2 pi]), 1/2 on the shadow or
 * reflection boundary, 0 beyond.
 * Near zeta = 0 the kernel peaks (width ~ a) when the receiver is near a shadow or reflection boundary;
 * H0(k L) int K is subtracted and added back in closed form (L = r + r0). Beyond k Rz = max(k L + 2 pi, 25)
 * the path turns into the complex plane, Rz = Rs + i y, where H0 decays like e^{-k y} (no singularity
 * lies to the right of Rs: the branch points are at +-(r + r0), +-(r - r0) and the kernel's poles at
 * real Rz <= r + r0), using the large-argument expansion of ./hankel.ts.
 */
import { besselJRatioRun, besselJRun, besselYRun, type OrderRun } from "./bessel-sequences";
import { add, type Complex, complex, divide, magnitude, multiply, scale, sqrt as complexSqrt, subtract } from "./complex";
import { freeFieldGreen2D, hankel1, hankel1Asymptotic } from "./hankel";
import { integrateOverPanels } from "./quadrature";

/** Quadrature accuracy of the diffraction integral; H0 itself is good to about 1e-8 (see ./hankel.ts). */
const QUADRATURE_TOLERANCE = 1e-10;

/** A position in polar coordinates about the edge. */
export interface EdgePolarPosition {
  /** Distance from the edge, m (>= 0). */
  readonly radius: number;
  /** Angle from the screen's upper face through the open region, rad, in [0, 2 pi]. */
  readonly angle: number;
}

export interface PlanePoint {
  readonly x: number;
  readonly y: number;
}

/**
 * Polar position of `point` about an edge at `edge`, the screen running from the edge along
 * `screenDirection` (any length). The angle is counter-clockwise from the screen, in [0, 2 pi).
 * A point on the screen itself gets angle 0; give 2 pi yourself when it is meant to be on the lower face.
 */
export function polarAboutEdge(edge: PlanePoint, screenDirection: PlanePoint, point: PlanePoint): EdgePolarPosition {
  const length = Math.hypot(screenDirection.x, screenDirection.y);
  if (!(length > 0)) throw new RangeError("screen direction must be a non-zero vector");
  const ux = screenDirection.x / length;
  const uy = screenDirection.y / length;
  const dx = point.x - edge.x;
  const dy = point.y - edge.y;
  let angle = Math.atan2(ux * dy - uy * dx, ux * dx + uy * dy);
  if (angle < 0) angle += 2 * Math.PI;
  // atan2 gives -0 just below the screen line; report it as 0.
  return { radius: Math.hypot(dx, dy), angle: angle === 0 ? 0 : angle };
}

function checkPosition(name: string, position: EdgePolarPosition): void {
  if (!(position.radius >= 0) || !(position.angle >= 0 && position.angle <= 2 * Math.PI)) {
    throw new RangeError(`${name} must have radius >= 0 and angle in [0, 2 pi], got ${JSON.stringify(position)}`);
  }
}

/** Straight-line distance between two positions given about the edge, m. */
export function distanceBetween(a: EdgePolarPosition, b: EdgePolarPosition): number {
  return distanceAtSeparation(a.radius, b.radius, a.angle - b.angle);
}

/** Free-field Green's function (i/4) H0^(1)(k R) between source and receiver (no screen). */
export function freeFieldGreenBetween(wavenumber: number, source: EdgePolarPosition, receiver: EdgePolarPosition): Complex {
  return freeFieldGreen2D(wavenumber, distanceBetween(source, receiver));
}

/**
 * Angular separation psi taken modulo 4 pi into (-2 pi, 2 pi] (the field lives on a two-sheeted surface).
 * Visibility and the diffraction kernel both use this value, so they agree on which side of a shadow or
 * reflection boundary a receiver lies even when rounding puts it within an ulp of the boundary.
 */
export function reduceSeparation(psi: number): number {
  let reduced = psi % (4 * Math.PI);
  if (reduced > 2 * Math.PI) reduced -= 4 * Math.PI;
  if (reduced <= -2 * Math.PI) reduced += 4 * Math.PI;
  return reduced;
}

/** Weight of a geometrical-optics wave at reduced separation psi: 1 visible, 1/2 on the boundary, 0 hidden. */
export function visibility(reducedPsi: number): number {
  const margin = Math.PI - Math.abs(reducedPsi);
  if (margin > 0) return 1;
  if (margin === 0) return 0.5;
  return 0;
}

/**
 * Exact total field G at the receiver for a unit line source (integral form; see the module comment):
 * the Green's function, to be multiplied by the source strength. Time factor e^{-i omega t}.
 * @param wavenumber k = 2 pi f / c, rad/m (> 0)
 */
export function halfPlaneGreen(wavenumber: number, source: EdgePolarPosition, receiver: EdgePolarPosition): Complex {
  checkPosition("source", source);
  checkPosition("receiver", receiver);
  if (!(wavenumber > 0)) throw new RangeError(`wavenumber must be positive, got ${wavenumber}`);
  const k = wavenumber;
  const r = receiver.radius;
  const r0 = source.radius;
  const psiMinus = reduceSeparation(receiver.angle - source.angle);
  const psiPlus = reduceSeparation(receiver.angle + source.angle);
  if (distanceBetween(source, receiver) === 0) throw new RangeError("receiver coincides with the source");
  // On the edge only the n = 0 term of the series survives: the free field at distance r + r0.
  if (r === 0 || r0 === 0) return freeFieldGreen2D(k, r + r0);

  // Geometrical part: direct wave and the wave reflected by the upper or lower face (the image).
  let total = complex(0, 0);
  const direct = visibility(psiMinus);
  if (direct > 0) total = add(total, scale(freeFieldGreen2D(k, distanceAtSeparation(r, r0, psiMinus)), direct));
  const reflected = visibility(psiPlus);
  if (reflected > 0) total = add(total, scale(freeFieldGreen2D(k, distanceAtSeparation(r, r0, psiPlus)), reflected));

  const diffractedIntegral = edgeDiffractionIntegral(k, r, r0, psiMinus, psiPlus);
  // - (i / (8 pi)) * integral
  const factor = 1 / (8 * Math.PI);
  return add(total, complex(factor * diffractedIntegral.im, -factor * diffractedIntegral.re));
}

function distanceAtSeparation(r: number, r0: number, psi: number): number {
  // r^2 + r0^2 - 2 r r0 cos psi = (r - r0)^2 + 4 r r0 sin^2(psi / 2), free of cancellation.
  const s = Math.sin(0.5 * psi);
  return Math.sqrt((r - r0) * (r - r0) + 4 * r * r0 * s * s);
}

/** One of the four angles a = (pi +- psi)/2 of the kernel, as the sines and cosines the kernel needs. */
interface KernelAngle {
  readonly sinA: number;
  readonly cosA: number;
  readonly sinHalfSquared: number;
  readonly sinHalf: number;
  readonly cosHalf: number;
}

function kernelAngles(psiMinus: number, psiPlus: number): KernelAngle[] {
  const angles: KernelAngle[] = [];
  for (const psi of [psiMinus, psiPlus]) {
    for (const sign of [1, -1]) {
      const a = 0.5 * (Math.PI + sign * psi);
      const sinHalf = Math.sin(0.5 * a);
      angles.push({ sinA: Math.sin(a), cosA: Math.cos(a), sinHalfSquared: sinHalf * sinHalf, sinHalf, cosHalf: Math.cos(0.5 * a) });
    }
  }
  return angles;
}

/** K(zeta) for real zeta, using cosh(zeta/2) - cos a = 2 sinh^2(zeta/4) + 2 sin^2(a/2) (no cancellation). */
function kernelReal(angles: readonly KernelAngle[], zeta: number): number {
  const sh = Math.sinh(0.25 * zeta);
  const twoSinhSquared = 2 * sh * sh;
  let sum = 0;
  for (const angle of angles) {
    const denominator = twoSinhSquared + 2 * angle.sinHalfSquared;
    if (denominator > 0) sum += angle.sinA / (2 * denominator);
  }
  return sum;
}

/**
 * int_0^Z K dzeta in closed form: each angle gives 2 atan(tanh(Z/4) cot(a/2)). Exactly on a boundary
 * (a = 0 mod 2 pi) the kernel vanishes and the term is 0, the mean of its limits +-pi on either side.
 */
function kernelIntegral(angles: readonly KernelAngle[], upper: number): number {
  const t = Math.tanh(0.25 * upper);
  let sum = 0;
  for (const angle of angles) {
    if (angle.sinHalf === 0) continue;
    sum += 2 * Math.atan((t * angle.cosHalf) / angle.sinHalf);
  }
  return sum;
}

/** int_0^inf H0(k Rz(zeta)) K(zeta) dzeta. */
function edgeDiffractionIntegral(k: number, r: number, r0: number, psiMinus: number, psiPlus: number): Complex {
  const angles = kernelAngles(psiMinus, psiPlus);
  const rr0 = r * r0;
  const pathLength = r + r0;
  const difference = r - r0;
  // Where the real path ends: a wavelength beyond the edge path, and far enough for the expansion of H0.
  const switchRadius = Math.max(pathLength + (2 * Math.PI) / k, 25 / k);
  // cosh(zeta) = (R^2 - r^2 - r0^2) / (2 r r0)  <=>  sinh^2(zeta/2) = (R^2 - L^2) / (4 r r0)
  const switchZeta = 2 * Math.asinh(Math.sqrt((switchRadius * switchRadius - pathLength * pathLength) / (4 * rr0)));

  // Segment 1, real zeta in [0, switchZeta]: [H0(k Rz) - H0(k L)] K, plus H0(k L) int K in closed form.
  const hankelAtEdgePath = hankel1(0, k * pathLength);
  const segment1 = new Float64Array(2);
  const breakpoints1: number[] = [0];
  for (const fraction of [1 / 256, 1 / 64, 1 / 16, 1 / 4, 1 / 2, 1]) breakpoints1.push(fraction * switchZeta);
  integrateOverPanels(
    (zeta, out) => {
      const sh = Math.sinh(0.5 * zeta);
      const radius = Math.sqrt(pathLength * pathLength + 4 * rr0 * sh * sh);
      const h = hankel1(0, k * radius);
      const kernel = kernelReal(angles, zeta);
      out[0] = (h.re - hankelAtEdgePath.re) * kernel;
      out[1] = (h.im - hankelAtEdgePath.im) * kernel;
    },
    breakpoints1,
    2,
    segment1,
    { relativeTolerance: QUADRATURE_TOLERANCE },
  );
  const closedForm = scale(hankelAtEdgePath, kernelIntegral(angles, switchZeta));

  // Segment 2, Rz = Rs + i y, y in [0, inf): dzeta = (dzeta/dR) i dy,
  // dzeta/dR = 2R / (sqrt(R^2 - L^2) sqrt(R^2 - D^2)), cosh(zeta/2) = sqrt(R^2 - D^2) / (2 sqrt(r r0)).
  const segment2 = new Float64Array(2);
  const twoSqrtRr0 = 2 * Math.sqrt(rr0);
  integrateOverPanels(
    (y, out) => {
      const radius = complex(switchRadius, y);
      const radiusSquared = multiply(radius, radius);
      const rootL = complexSqrt(subtract(radiusSquared, complex(pathLength * pathLength)));
      const rootD = complexSqrt(subtract(radiusSquared, complex(difference * difference)));
      const coshHalf = scale(rootD, 1 / twoSqrtRr0);
      let kernel = complex(0, 0);
      for (const angle of angles) {
        kernel = add(kernel, divide(complex(angle.sinA / 2), subtract(coshHalf, complex(angle.cosA))));
      }
      const jacobian = divide(scale(radius, 2), multiply(rootL, rootD));
      const h = hankel1Asymptotic(0, scale(radius, k));
      const value = multiply(multiply(h, kernel), jacobian);
      // times i (dR = i dy)
      out[0] = -value.im;
      out[1] = value.re;
    },
    [0, 0.5 / k, 2 / k, 6 / k, 14 / k, 26 / k, 45 / k],
    2,
    segment2,
    { relativeTolerance: QUADRATURE_TOLERANCE },
  );
  return add(add(complex(segment1[0] ?? 0, segment1[1] ?? 0), closedForm), complex(segment2[0] ?? 0, segment2[1] ?? 0));
}

/** Largest order the series may reach before giving up. */
const SERIES_ORDER_LIMIT = 20000;

/**
 * Exact total field from the eigenfunction series (see the module comment). Converges geometrically with
 * ratio sqrt(r< / r>); throws a RangeError when r = r0 (use halfPlaneGreen there) or when r and r0 are
 * so close that more than 20000 orders would be needed.
 */
export function halfPlaneGreenSeries(wavenumber: number, source: EdgePolarPosition, receiver: EdgePolarPosition): Complex {
  checkPosition("source", source);
  checkPosition("receiver", receiver);
  if (!(wavenumber > 0)) throw new RangeError(`wavenumber must be positive, got ${wavenumber}`);
  const inner = Math.min(source.radius, receiver.radius) * wavenumber;
  const outer = Math.max(source.radius, receiver.radius) * wavenumber;
  if (inner === 0) return freeFieldGreen2D(wavenumber, outer / wavenumber);
  if (inner === outer) throw new RangeError("the series does not converge when source and receiver are equally far from the edge");
  // Orders needed: past x< (where J starts to fall) and until (x< / x>)^nu < 1e-17.
  let orders = Math.ceil(Math.max(inner + 40 + 4 * Math.cbrt(inner), 40 / Math.log(outer / inner)));
  while (orders <= SERIES_ORDER_LIMIT) {
    const result = sumSeries(inner, outer, source.angle, receiver.angle, orders);
    if (result) return result;
    orders *= 2;
  }
  throw new RangeError(`the series did not converge within order ${SERIES_ORDER_LIMIT}: r and r0 are too close`);
}

/**
 * Products J_nu(x<) J_nu(x>) and J_nu(x<) Y_nu(x>) for nu = nu0 + m, m < count. Below the turning point
 * they come from the Bessel values; beyond nu = x> + 1, where J underflows and Y overflows at high order,
 * from the ratios J_nu / J_{nu-1} (Miller) and Y_nu / Y_{nu-1} (upward, sigma_{m+1} = 2 nu / x - 1 / sigma_m).
 */
function besselProducts(run: OrderRun, inner: number, outer: number, count: number): { jj: Float64Array; jy: Float64Array } {
  const jj = new Float64Array(count);
  const jy = new Float64Array(count);
  const nu0 = run === "integer" ? 0 : 0.5;
  // First index whose order exceeds x> + 1, and at least 2 so two Y values seed the ratio recurrence.
  const direct = Math.min(count, Math.max(2, Math.ceil(outer + 2 - nu0)));
  const jInner = new Float64Array(direct);
  const jOuter = new Float64Array(direct);
  const yOuter = new Float64Array(direct);
  besselJRun(run, inner, jInner);
  besselJRun(run, outer, jOuter);
  besselYRun(run, outer, yOuter);
  for (let m = 0; m < direct; m++) {
    jj[m] = (jInner[m] ?? 0) * (jOuter[m] ?? 0);
    jy[m] = (jInner[m] ?? 0) * (yOuter[m] ?? 0);
  }
  if (direct >= count) return { jj, jy };
  const ratioInner = new Float64Array(count);
  const ratioOuter = new Float64Array(count);
  besselJRatioRun(run, inner, ratioInner);
  besselJRatioRun(run, outer, ratioOuter);
  let sigma = (yOuter[direct - 1] ?? 0) / (yOuter[direct - 2] ?? 1);
  for (let m = direct; m < count; m++) {
    sigma = (2 * (nu0 + m - 1)) / outer - 1 / sigma;
    const rhoInner = ratioInner[m] ?? 0;
    jj[m] = (jj[m - 1] ?? 0) * rhoInner * (ratioOuter[m] ?? 0);
    jy[m] = (jy[m - 1] ?? 0) * rhoInner * sigma;
  }
  return { jj, jy };
}

/** Sums the series over orders nu = n/2 <= maxOrder; null when it has not converged by then. */
function sumSeries(inner: number, outer: number, sourceAngle: number, receiverAngle: number, maxOrder: number): Complex | null {
  const count = maxOrder + 1;
  const integer = besselProducts("integer", inner, outer, count);
  const halfInteger = besselProducts("halfInteger", inner, outer, count);
  let sumRe = 0;
  let sumIm = 0;
  let quietTerms = 0;
  for (let n = 0; n < 2 * count; n++) {
    const products = n % 2 === 0 ? integer : halfInteger;
    const m = n >> 1;
    const jj = products.jj[m] ?? 0;
    const jy = products.jy[m] ?? 0;
    const weight = n === 0 ? 1 : 2;
    const angular = weight * Math.cos(0.5 * n * receiverAngle) * Math.cos(0.5 * n * sourceAngle);
    sumRe += angular * jj;
    sumIm += angular * jy;
    // |eps_n J_nu(x<) H_nu(x>)| bounds the term whatever the angles.
    const bound = weight * Math.hypot(jj, jy);
    if (!Number.isFinite(bound)) return null;
    if (0.5 * n > inner && bound < 1e-17 * Math.hypot(sumRe, sumIm)) {
      quietTerms++;
      if (quietTerms >= 4) return complex(-0.25 * sumIm, 0.25 * sumRe); // (i/4) * sum
    } else {
      quietTerms = 0;
    }
  }
  return null;
}

/**
 * Insertion loss of the screen, 20 log10(|G_free| / |G_total|), dB: positive where the screen shields.
 * @param wavenumber k = 2 pi f / c, rad/m
 */
export function halfPlaneInsertionLoss(wavenumber: number, source: EdgePolarPosition, receiver: EdgePolarPosition): number {
  const free = magnitude(freeFieldGreenBetween(wavenumber, source, receiver));
  const screened = magnitude(halfPlaneGreen(wavenumber, source, receiver));
  return 20 * Math.log10(free / screened);
}
