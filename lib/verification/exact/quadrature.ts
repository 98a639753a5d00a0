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
  /** Panels the interval is first cut into by integrateAdaptive (default 8). */
  initialPanels?: number;
  /** Most panels the refinement may create; it stops there even if short of the tolerance (default 4000). */
  maxPanels?: number;
  /** Points of the Gauss-Legendre rule per panel (default 10). */
  order?: number;
}

/**
 * Adaptive Gauss-Legendre integral of a smooth vector-valued f over [a, b], added into `result`.
 * See integrateOverPanels.
 */
export function integrateAdaptive(f: VectorIntegrand, a: number, b: number, dimension: number, result: Float64Array, options: AdaptiveOptions = {}): void {
  const initialPanels = options.initialPanels ?? 8;
  const breakpoints: number[] = [];
  for (let p = 0; p <= initialPanels; p++) breakpoints.push(p === initialPanels ? b : a + ((b - a) * p) / initialPanels);
  integrateOverPanels(f, breakpoints, dimension, result, options);
}

interface Panel {
  readonly lo: number;
  readonly hi: number;
  /** Rule applied to the two halves (the better estimate). */
  readonly value: Float64Array;
  /** |halves - whole|, summed over components: the panel's error estimate. */
  readonly error: number;
  /** Sum of |w f| over the halves: the scale rounding errors are measured against. */
  readonly absolute: number;
}

/**
 * Globally adaptive Gauss-Legendre integral of a smooth vector-valued f, added into `result`, over the panels
 * between consecutive `breakpoints` (ascending or descending; put breakpoints where f has kinks or changes
 * scale). Each panel's error is the difference between the rule on the panel and on its two halves; the
 * panel with the largest error is split until the summed error is below relativeTolerance * int |f|.
 * Panels whose error is at rounding level are left alone, and refinement stops at maxPanels, so noise in f
 * (e.g. from approximated special functions) cannot make it run away.
 */
export function integrateOverPanels(f: VectorIntegrand, breakpoints: ArrayLike<number>, dimension: number, result: Float64Array, options: AdaptiveOptions = {}): void {
  const relativeTolerance = options.relativeTolerance ?? 1e-10;
  const maxPanels = options.maxPanels ?? 4000;
  const rule = gaussLegendreRule(options.order ?? 10);
  const out = new Float64Array(dimension);
  const whole = new Float64Array(dimension);

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
  const evaluate = (lo: number, hi: number): Panel => {
    whole.fill(0);
    applyRule(lo, hi, whole);
    const value = new Float64Array(dimension);
    const middle = 0.5 * (lo + hi);
    const absolute = applyRule(lo, middle, value) + applyRule(middle, hi, value);
    let error = 0;
    for (let d = 0; d < dimension; d++) error += Math.abs((value[d] ?? 0) - (whole[d] ?? 0));
    return { lo, hi, value, error: Number.isFinite(error) ? error : 0, absolute };
  };

  // Max-heap of panels by error.
  const heap: Panel[] = [];
  const push = (panel: Panel) => {
    heap.push(panel);
    let i = heap.length - 1;
    while (i > 0) {
      const parent = (i - 1) >> 1;
      const up = heap[parent];
      const here = heap[i];
      if (!up || !here || up.error >= here.error) break;
      heap[parent] = here;
      heap[i] = up;
      i = parent;
    }
  };
  const pop = (): Panel | undefined => {
    const top = heap[0];
    const last = heap.pop();
    if (heap.length > 0 && last) {
      heap[0] = last;
      let i = 0;
      for (;;) {
        const left = 2 * i + 1;
        const right = left + 1;
        let largest = i;
        if ((heap[left]?.error ?? -1) > (heap[largest]?.error ?? -1)) largest = left;
        if ((heap[right]?.error ?? -1) > (heap[largest]?.error ?? -1)) largest = right;
        if (largest === i) break;
        const a = heap[i];
        const b = heap[largest];
        if (!a || !b) break;
        heap[i] = b;
        heap[largest] = a;
        i = largest;
      }
    }
    return top;
  };

  const done = new Float64Array(dimension);
  let totalError = 0;
  let totalAbsolute = 0;
  let panels = 0;
  for (let p = 0; p + 1 < breakpoints.length; p++) {
    const lo = breakpoints[p] ?? 0;
    const hi = breakpoints[p + 1] ?? 0;
    if (lo === hi) continue;
    const panel = evaluate(lo, hi);
    push(panel);
    totalError += panel.error;
    totalAbsolute += panel.absolute;
    panels++;
  }
  const roundingLevel = 64 * Number.EPSILON;
  while (heap.length > 0 && totalError > relativeTolerance * totalAbsolute && panels < maxPanels) {
    const worst = pop();
    if (!worst) break;
    const middle = 0.5 * (worst.lo + worst.hi);
    // At rounding level, or too narrow to split: keep as it is.
    if (worst.error <= roundingLevel * worst.absolute || middle === worst.lo || middle === worst.hi) {
      for (let d = 0; d < dimension; d++) done[d] = (done[d] ?? 0) + (worst.value[d] ?? 0);
      totalError -= worst.error;
      continue;
    }
    const left = evaluate(worst.lo, middle);
    const right = evaluate(middle, worst.hi);
    push(left);
    push(right);
    totalError += left.error + right.error - worst.error;
    totalAbsolute += left.absolute + right.absolute - worst.absolute;
    panels++;
  }
  for (const panel of heap) for (let d = 0; d < dimension; d++) done[d] = (done[d] ?? 0) + (panel.value[d] ?? 0);
  for (let d = 0; d < dimension; d++) result[d] = (result[d] ?? 0) + (done[d] ?? 0);
}

/** Adaptive integral of a real function (see integrateAdaptive). */
export function integrateReal(f: (x: number) => number, a: number, b: number, options: AdaptiveOptions = {}): number {
  const result = new Float64Array(1);
  integrateAdaptive((x, out) => {
    out[0] = f(x);
  }, a, b, 1, result, options);
  return result[0] ?? 0;
}
