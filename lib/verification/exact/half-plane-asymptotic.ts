/**
 * Uniform asymptotic (large k) approximation of the line-source field at a rigid half-plane: the uniform
 * geometrical theory of diffraction of Kouyoumjian & Pathak ("A uniform geometrical theory of diffraction
 * for an edge in a perfectly conducting surface", Proc. IEEE 62, 1448-1461, 1974), written for the time
 * factor e^{-i omega t} (the paper uses e^{+j omega t}: every i below is -j there). A rigid acoustic screen
 * takes the paper's "hard" (+) combination. With the angles of ./half-plane.ts (screen at 0 and 2 pi):
 *
 *   G ~ (i/4) [chi(psi-) H0(k R-) + chi(psi+) H0(k R+)] + (i/4) H0(k r0) D e^{ikr} / sqrt(r),
 *   D = -e^{i pi/4} / (2 sqrt(2 pi k)) [sec(psi-/2) F(k L a(psi-)) + sec(psi+/2) F(k L a(psi+))],
 *   a(beta) = 2 cos^2(beta/2),   L = r r0 / (r + r0),   psi-+ = theta -+ theta0,
 *
 * with the transition function F(X) = -2i sqrt(X) e^{-iX} int_{sqrt X}^inf e^{i t^2} dt. In terms of the
 * Fresnel auxiliary functions (A&S 7.3.5-6), int_{sqrt X}^inf e^{i t^2} dt = sqrt(pi/2) (g + i f) e^{iX}
 * at u = sqrt(2X/pi), hence F(X) = sqrt(2 pi X) (f(u) - i g(u)): F -> 1 for large X (Keller's geometrical
 * theory of diffraction) and the field stays continuous across the shadow and reflection boundaries.
 * Its error is O(1/(k r)) relative to the diffracted wave.
 */
import { add, type Complex, complex, multiply, scale } from "./complex";
import { fresnelAuxiliary } from "./fresnel";
import { freeFieldGreen2D } from "./hankel";
import { distanceBetween, type EdgePolarPosition, reduceSeparation, visibility } from "./half-plane";

/** Kouyoumjian-Pathak transition function F(X) for X >= 0, time factor e^{-i omega t}. */
export function transitionFunction(x: number): Complex {
  if (!(x >= 0)) throw new RangeError(`transition function needs X >= 0, got ${x}`);
  if (x === 0) return complex(0, 0);
  const { f, g } = fresnelAuxiliary(Math.sqrt((2 * x) / Math.PI));
  const amplitude = Math.sqrt(2 * Math.PI * x);
  return complex(amplitude * f, -amplitude * g);
}

/**
 * sec(beta/2) F(k L a(beta)) with a = 2 cos^2(beta/2). cos(beta/2) = sin(margin/2), margin = pi - |beta|
 * for the reduced separation, so its sign flips exactly where the geometrical wave appears or vanishes.
 * On the boundary itself the term is 0, the mean of its two one-sided limits.
 */
function diffractionTerm(reducedBeta: number, kL: number): Complex {
  const c = Math.sin(0.5 * (Math.PI - Math.abs(reducedBeta)));
  if (c === 0) return complex(0, 0);
  return scale(transitionFunction(2 * kL * c * c), 1 / c);
}

/** Edge-diffracted wave alone (the term with D above). */
export function halfPlaneDiffractedUniformAsymptotic(wavenumber: number, source: EdgePolarPosition, receiver: EdgePolarPosition): Complex {
  const k = wavenumber;
  const r = receiver.radius;
  const r0 = source.radius;
  const kL = (k * r * r0) / (r + r0);
  const sum = add(diffractionTerm(reduceSeparation(receiver.angle - source.angle), kL), diffractionTerm(reduceSeparation(receiver.angle + source.angle), kL));
  // D = -e^{i pi/4} / (2 sqrt(2 pi k)) * sum
  const coefficient = scale(complex(Math.SQRT1_2, Math.SQRT1_2), -1 / (2 * Math.sqrt(2 * Math.PI * k)));
  const incidentAtEdge = freeFieldGreen2D(k, r0);
  const spreading = scale(complex(Math.cos(k * r), Math.sin(k * r)), 1 / Math.sqrt(r));
  return multiply(multiply(incidentAtEdge, multiply(coefficient, sum)), spreading);
}

/** Total field, uniform asymptotic approximation (see the module comment). */
export function halfPlaneGreenUniformAsymptotic(wavenumber: number, source: EdgePolarPosition, receiver: EdgePolarPosition): Complex {
  let total = halfPlaneDiffractedUniformAsymptotic(wavenumber, source, receiver);
  const direct = visibility(reduceSeparation(receiver.angle - source.angle));
  if (direct > 0) total = add(total, scale(freeFieldGreen2D(wavenumber, distanceBetween(source, receiver)), direct));
  const reflected = visibility(reduceSeparation(receiver.angle + source.angle));
  if (reflected > 0) {
    const image = { radius: source.radius, angle: -source.angle };
    total = add(total, scale(freeFieldGreen2D(wavenumber, distanceBetween(image, receiver)), reflected));
  }
  return total;
}
