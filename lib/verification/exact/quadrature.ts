// Numerical integration for the reference solutions: Gauss-Legendre rules and an adaptive integrator
// for smooth vector-valued integrands (a complex integrand is a vector of length 2).

export interface QuadratureRule {
  /** Nodes on [-1, 1], ascending. */
  readonly nodes: Float64Array;
  readonly weights: Float64Array;
}

const ruleCache = new Map<number, QuadratureRule>();

/**
 * n-point Gauss-Legendre rule on [-1, 1] (exact for polynomials of degree 2n - 1; A&S 25.4.29).
 * Nodes are the roots of P_n found by Newton's method from Tricomi's estimate
 * cos(pi (i - 1/4) / (n + 1/2)); weights 2 / ((1 - x^2) P_n'(x)^2).
 */
export function gaussLegendreRule(n: number): QuadratureRule {
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`Gauss-Legendre rule needs n >= 1, got ${n}`);
  const cached = ruleCache.get(n);
  if (cached) return cached;
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let derivative = 0;
    for (let iteration = 0; iteration < 100; iteration++) {
      // Three-term recurrence (j + 1) P_{j+1} = (2j + 1) x P_j - j P_{j-1}.
      let previous = 1;
      let current = x;
      for (let j = 1; j < n; j++) {
        const next = ((2 * j + 1) * x * current - j * previous) / (j + 1);
        previous = current;
        current = next;
      }
      // P_n'(x) = n (x P_n - P_{n-1}) / (x^2 - 1)
      derivative = (n * (x * current - previous)) / (x * x - 1);
      const change = current / derivative;
      x -= change;
      if (Math.abs(change) < 1e-16) break;
    }
    nodes[n - 1 - i] = x;
    weights[n - 1 - i] = 2 / ((1 - x * x) * derivative * derivative);
  }
  const rule = { nodes, weights };
  ruleCache.set(n, rule);
  return rule;
}

/** Integrand of dimension `dimension`: writes f(x) into `out` (length = dimension). */
export type VectorIntegrand = (x: number, out: Float64Array) => void;

export interface AdaptiveOptions {
  /** Relative accuracy wanted, measured against the integral of |f| (default 1e-10). */
  relativeTolerance?: number;
  /** Panels the interval is first cut into (default 8). */
  initialPanels?: number;
  /** Maximum bisection depth of a panel (default 40). */
  maxDepth?: number;
  /** Points of the Gauss-Legendre rule per panel (default 10). */
  order?: number;
}

/**
 * Adaptive Gauss-Legendre integral of a smooth vector-valued f over [a, b], added into `result`.
 * A panel is accepted when the rule on the whole panel agrees with the sum over its two halves.
 * The tolerance is relative to a first estimate of int |f|, so cancelling integrands still converge.
 */
export function integrateAdaptive(f: VectorIntegrand, a: number, b: number, dimension: number, result: Float64Array, options: AdaptiveOptions = {}): void {
  const initialPanels = options.initialPanels ?? 8;
  const breakpoints: number[] = [];
  for (let p = 0; p <= initialPanels; p++) breakpoints.push(p === initialPanels ? b : a + ((b - a) * p) / initialPanels);
  integrateOverPanels(f, breakpoints, dimension, result, options);
}

/**
 * As integrateAdaptive, over the panels between consecutive `breakpoints` (ascending or descending);
 * put breakpoints where f has kinks or changes scale.
 */
export function integrateOverPanels(f: VectorIntegrand, breakpoints: ArrayLike<number>, dimension: number, result: Float64Array, options: AdaptiveOptions = {}): void {
  const relativeTolerance = options.relativeTolerance ?? 1e-10;
  const maxDepth = options.maxDepth ?? 40;
  const rule = gaussLegendreRule(options.order ?? 10);
  const panelCount = breakpoints.length - 1;
  if (panelCount < 1) return;
  const value = new Float64Array(dimension);
  const out = new Float64Array(dimension);
  const whole = new Float64Array(dimension);
  const halves = new Float64Array(dimension);

  const applyRule = (lo: number, hi: number, sum: Float64Array): number => {
    const half = 0.5 * (hi - lo);
    const middle = 0.5 * (hi + lo);
    let absolute = 0;
    for (let i = 0; i < rule.nodes.length; i++) {
      f(middle + half * (rule.nodes[i] ?? 0), out);
      const w = half * (rule.weights[i] ?? 0);
      for (let d = 0; d < dimension; d++) {
        const v = w * (out[d] ?? 0);
        sum[d] = (sum[d] ?? 0) + v;
        absolute += Math.abs(v);
      }
    }
    return absolute;
  };

  // First pass: a scale for the tolerance, int |f| over all panels.
  let scaleEstimate = 0;
  let totalWidth = 0;
  for (let p = 0; p < panelCount; p++) {
    const lo = breakpoints[p] ?? 0;
    const hi = breakpoints[p + 1] ?? 0;
    scaleEstimate += applyRule(lo, hi, whole);
    totalWidth += Math.abs(hi - lo);
  }
  if (totalWidth === 0) return;
  const tolerance = relativeTolerance * scaleEstimate;

  // Depth-first over panels, each stored as [lo, hi, depth].
  const stack: number[] = [];
  for (let p = panelCount - 1; p >= 0; p--) stack.push(breakpoints[p] ?? 0, breakpoints[p + 1] ?? 0, 0);
  while (stack.length > 0) {
    const depth = stack.pop() ?? 0;
    const hi = stack.pop() ?? 0;
    const lo = stack.pop() ?? 0;
    if (lo === hi) continue;
    whole.fill(0);
    halves.fill(0);
    applyRule(lo, hi, whole);
    const middle = 0.5 * (lo + hi);
    applyRule(lo, middle, halves);
    applyRule(middle, hi, halves);
    let error = 0;
    for (let d = 0; d < dimension; d++) error += Math.abs((halves[d] ?? 0) - (whole[d] ?? 0));
    const allowed = (tolerance * Math.abs(hi - lo)) / totalWidth;
    if (error <= allowed || depth >= maxDepth || !Number.isFinite(error)) {
      for (let d = 0; d < dimension; d++) value[d] = (value[d] ?? 0) + (halves[d] ?? 0);
    } else {
      stack.push(lo, middle, depth + 1, middle, hi, depth + 1);
    }
  }
  for (let d = 0; d < dimension; d++) result[d] = (result[d] ?? 0) + (value[d] ?? 0);
}

/** Adaptive integral of a real function (see integrateAdaptive). */
export function integrateReal(f: (x: number) => number, a: number, b: number, options: AdaptiveOptions = {}): number {
  const result = new Float64Array(1);
  integrateAdaptive((x, out) => {
    out[0] = f(x);
  }, a, b, 1, result, options);
  return result[0] ?? 0;
}
