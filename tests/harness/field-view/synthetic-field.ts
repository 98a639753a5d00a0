// A physically sensible field for the visual harness, without the solver: the exact 2D (line-source)
// pulse of a Ricker volume-velocity source over a rigid ground, by the image-source method.
//
// Free field: p(r, t) = rho / (2 pi) * integral from r/c to t of qdot(t - tau) / sqrt(tau^2 - r^2/c^2) dtau,
// the time derivative of the volume-injection rate per unit length convolved with the 2D Green's function
// of the wave equation (Morse & Ingard, Theoretical Acoustics, 1968, section 7.3 on cylindrical waves).
// The singular kernel is integrated exactly over each time bin: integral of dtau / sqrt(tau^2 - a^2) is
// acosh(tau / a). A rigid ground at y = 0 adds the mirror source at (xs, -ys) with the same sign.
// Intensity uses the far-field relation v = p / (rho c) along each path (accurate a few wavelengths out).
import { pointInPolygon } from "@/lib/fdtd/geometry";
import type { Scene } from "@/lib/fdtd/scene";
import type { FieldSnapshot, LevelMaps } from "@/lib/fdtd/simulation";

export interface SyntheticRun {
  /** Pressure snapshot at time t, with the ground reflection (this run). */
  pressureAt(time: number): FieldSnapshot;
  /** Peak and RMS maps over the run: with the ground (this run) and in free field (the reference). */
  levelMaps: LevelMaps;
  freeFieldLevelMaps: LevelMaps;
  /** Time-averaged intensity components, W/m^2, with the ground. */
  intensity: { x: FieldSnapshot; y: FieldSnapshot };
  duration: number;
}

export interface SyntheticGrid {
  cellSize: number;
  width: number;
  height: number;
  timeStep: number;
  soundSpeed: number;
  density: number;
}

/** Ricker volume-velocity q(t) = A (1 - 2 s^2) exp(-s^2), s = pi f (t - t0); its derivative. */
function rickerRate(amplitude: number, peakFrequency: number, delay: number): (t: number) => number {
  return (t) => {
    const s = Math.PI * peakFrequency * (t - delay);
    return amplitude * Math.PI * peakFrequency * (4 * s * s * s - 6 * s) * Math.exp(-s * s);
  };
}

/**
 * Radial table P[k][n]: free-field pressure at radius (k + 0.5) dr and time n dt for one source.
 * Only the bins where qdot is non-zero contribute, so each entry costs the pulse length, not the run length.
 */
function radialTable(maxRadius: number, dr: number, dt: number, steps: number, grid: SyntheticGrid, qdot: (t: number) => number, pulseEnd: number): Float32Array[] {
  const radii = Math.ceil(maxRadius / dr) + 2;
  const table: Float32Array[] = [];
  const factor = grid.density / (2 * Math.PI);
  const pulseBins = Math.ceil(pulseEnd / dt) + 2;
  for (let k = 0; k < radii; k++) {
    const r = (k + 0.5) * dr;
    const a = r / grid.soundSpeed;
    const series = new Float32Array(steps + 1);
    // Kernel weights w_m = acosh(tau_{m+1} / a) - acosh(tau_m / a), tau_m = a + m dt.
    const weights = new Float64Array(steps + 1);
    for (let m = 0; m <= steps; m++) weights[m] = Math.acosh((a + (m + 1) * dt) / a) - Math.acosh((a + m * dt) / a);
    for (let n = 0; n <= steps; n++) {
      const t = n * dt;
      if (t < a) continue;
      // Bin m covers tau in [a + m dt, a + (m+1) dt]; qdot is taken at the bin's middle.
      let sum = 0;
      const mFirst = Math.max(0, Math.floor((t - a - pulseEnd) / dt) - 1);
      const mLast = Math.min(steps, Math.floor((t - a) / dt));
      for (let m = mFirst; m <= mLast && m - mFirst < pulseBins + 2; m++) sum += weights[m]! * qdot(t - a - (m + 0.5) * dt);
      series[n] = factor * sum;
    }
    table.push(series);
  }
  return table;
}

export function makeSyntheticRun(scene: Scene, grid: SyntheticGrid): SyntheticRun {
  const source = scene.sources[0]!;
  if (source.signal.kind !== "ricker") throw new Error("the harness's analytic field needs a Ricker source");
  const f0 = source.signal.peakFrequency;
  const delay = source.signal.delay ?? 1.5 / f0;
  const qdot = rickerRate(source.amplitude, f0, delay);
  const duration = scene.duration.kind === "time" ? scene.duration.seconds : scene.duration.maxSeconds;
  const dt = 2.5e-4;
  const steps = Math.ceil(duration / dt);
  const dr = grid.soundSpeed * dt;
  const { width, height, cellSize: h } = grid;
  const maxRadius = Math.hypot(width * h + Math.abs(source.position.x), height * h + Math.abs(source.position.y) * 2);
  const table = radialTable(maxRadius, dr, dt, steps, grid, qdot, 2 * delay);
  const groundIsRigid = scene.boundary.bottom.kind === "rigid";
  const solids = scene.geometry.solids;
  const inside = new Uint8Array(width * height);
  for (let b = 0; b < height; b++) {
    for (let a = 0; a < width; a++) {
      const x = (a + 0.5) * h;
      const y = (b + 0.5) * h;
      if (solids.some((s) => pointInPolygon(x, y, s.polygon))) inside[b * width + a] = 1;
    }
  }

  const sample = (r: number, n: number) => {
    const x = Math.max(0, r / dr - 0.5);
    const k = Math.min(table.length - 2, Math.floor(x));
    const f = Math.min(1, x - k);
    return (1 - f) * table[k]![n]! + f * table[k + 1]![n]!;
  };
  const snapshot = (values: Float32Array, step: number, time: number): FieldSnapshot => ({ step, time, width, height, x0: h / 2, y0: h / 2, spacing: h, values });

  function pressureAt(time: number): FieldSnapshot {
    const values = new Float32Array(width * height);
    const nExact = Math.min(steps, Math.max(0, time / dt));
    const n0 = Math.min(steps - 1, Math.floor(nExact));
    const g = nExact - n0;
    for (let b = 0; b < height; b++) {
      const y = (b + 0.5) * h;
      for (let a = 0; a < width; a++) {
        if (inside[b * width + a]) continue;
        const x = (a + 0.5) * h;
        const r1 = Math.hypot(x - source.position.x, y - source.position.y);
        const r2 = Math.hypot(x - source.position.x, y + source.position.y);
        let p = (1 - g) * sample(r1, n0) + g * sample(r1, n0 + 1);
        if (groundIsRigid) p += (1 - g) * sample(r2, n0) + g * sample(r2, n0 + 1);
        values[b * width + a] = p;
      }
    }
    return snapshot(values, Math.round(time / grid.timeStep), time);
  }

  const peak = new Float32Array(width * height);
  const rms = new Float32Array(width * height);
  const freePeak = new Float32Array(width * height);
  const freeRms = new Float32Array(width * height);
  const intensityX = new Float32Array(width * height);
  const intensityY = new Float32Array(width * height);
  const rhoC = grid.density * grid.soundSpeed;
  for (let b = 0; b < height; b++) {
    const y = (b + 0.5) * h;
    for (let a = 0; a < width; a++) {
      const cell = b * width + a;
      if (inside[cell]) continue;
      const x = (a + 0.5) * h;
      const dx = x - source.position.x;
      const dy1 = y - source.position.y;
      const dy2 = y + source.position.y;
      const r1 = Math.hypot(dx, dy1);
      const r2 = Math.hypot(dx, dy2);
      let maxAbs = 0;
      let squares = 0;
      let freeMax = 0;
      let freeSquares = 0;
      let pp1 = 0;
      let pp2 = 0;
      for (let n = 0; n <= steps; n++) {
        const p1 = sample(r1, n);
        const p2 = groundIsRigid ? sample(r2, n) : 0;
        const p = p1 + p2;
        maxAbs = Math.max(maxAbs, Math.abs(p));
        squares += p * p;
        freeMax = Math.max(freeMax, Math.abs(p1));
        freeSquares += p1 * p1;
        pp1 += p * p1;
        pp2 += p * p2;
      }
      peak[cell] = maxAbs;
      rms[cell] = Math.sqrt(squares / (steps + 1));
      freePeak[cell] = freeMax;
      freeRms[cell] = Math.sqrt(freeSquares / (steps + 1));
      // I = < p v >, v = p1/(rho c) r1^ + p2/(rho c) r2^ (far field along each path).
      const scale = 1 / ((steps + 1) * rhoC);
      intensityX[cell] = scale * (pp1 * (dx / r1) + pp2 * (dx / r2));
      intensityY[cell] = scale * (pp1 * (dy1 / r1) + pp2 * (dy2 / r2));
    }
  }
  const samples = Math.round(duration / grid.timeStep);
  return {
    pressureAt,
    levelMaps: { peak: snapshot(peak, samples, duration), rms: snapshot(rms, samples, duration), samples },
    freeFieldLevelMaps: { peak: snapshot(freePeak, samples, duration), rms: snapshot(freeRms, samples, duration), samples },
    intensity: { x: snapshot(intensityX, samples, duration), y: snapshot(intensityY, samples, duration) },
    duration,
  };
}
