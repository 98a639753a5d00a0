// Minimal complex arithmetic for the frequency-domain reference solutions (values are plain objects, never mutated).

/** A complex number re + i im. */
export interface Complex {
  readonly re: number;
  readonly im: number;
}

export function complex(re: number, im = 0): Complex {
  return { re, im };
}

export function add(a: Complex, b: Complex): Complex {
  return { re: a.re + b.re, im: a.im + b.im };
}

export function subtract(a: Complex, b: Complex): Complex {
  return { re: a.re - b.re, im: a.im - b.im };
}

export function multiply(a: Complex, b: Complex): Complex {
  return { re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re };
}

export function scale(a: Complex, factor: number): Complex {
  return { re: a.re * factor, im: a.im * factor };
}

export function divide(a: Complex, b: Complex): Complex {
  // Smith's algorithm: avoids overflow when |b| is large or small.
  if (Math.abs(b.re) >= Math.abs(b.im)) {
    const ratio = b.im / b.re;
    const denominator = b.re + b.im * ratio;
    return { re: (a.re + a.im * ratio) / denominator, im: (a.im - a.re * ratio) / denominator };
  }
  const ratio = b.re / b.im;
  const denominator = b.re * ratio + b.im;
  return { re: (a.re * ratio + a.im) / denominator, im: (a.im * ratio - a.re) / denominator };
}

export function conjugate(a: Complex): Complex {
  return { re: a.re, im: -a.im };
}

export function magnitude(a: Complex): number {
  return Math.hypot(a.re, a.im);
}

export function phase(a: Complex): number {
  return Math.atan2(a.im, a.re);
}

/** e^{i angle}. */
export function unitPhasor(angle: number): Complex {
  return { re: Math.cos(angle), im: Math.sin(angle) };
}

/** e^{z}. */
export function exp(z: Complex): Complex {
  const modulus = Math.exp(z.re);
  return { re: modulus * Math.cos(z.im), im: modulus * Math.sin(z.im) };
}

/** Principal square root (branch cut on the negative real axis, result with re >= 0). */
export function sqrt(z: Complex): Complex {
  const modulus = magnitude(z);
  if (modulus === 0) return { re: 0, im: 0 };
  const re = Math.sqrt(0.5 * (modulus + Math.abs(z.re)));
  if (z.re >= 0) return { re, im: z.im / (2 * re) };
  return { re: Math.abs(z.im) / (2 * re), im: z.im >= 0 ? re : -re };
}
