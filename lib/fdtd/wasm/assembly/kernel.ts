// @ts-nocheck -- AssemblyScript source (f32, v128, load/store builtins), compiled by scripts/fdtd-build-wasm.ts, not by tsc.
/* eslint-disable */
//
// The WebAssembly SIMD kernel: the same sweep as lib/fdtd/kernel.ts (the reference), on the same state
// layout and parameter block, computing in float32 with the same operation order so that the fields are
// bit-identical. Four cells per 128-bit vector along a row (i runs fastest); a scalar tail finishes
// each row segment. Memory is imported: the caller lays the state out in it (lib/fdtd/layout.ts).
//
// One step, with a = decay, gv = velocity gain dt/(rho h), gp = pressure gain rho c^2 dt / h:
//   vx[j][i] = a vx[j][i] - gv (p[j][i] - p[j][i-1]),  vy[j][i] = a vy[j][i] - gv (p[j][i] - p[j-1][i])
//   p[j][i]  = a p[j][i]  - gp (vx[j][i+1] - vx[j][i] + vy[j+1][i] - vy[j][i])
// Every few steps flushStrip passes each stored value through (x + F) - F, which zeroes float32
// subnormals (slow on x86; WebAssembly has no flush-to-zero mode).

// Parameter block (lib/fdtd/kernel-params.ts): byte offset and slots.
const PARAMS: usize = 1024;
const P_NX: i32 = 0;
const P_NY: i32 = 1;
const P_STRIDE: i32 = 2;
const P_PML_LEFT: i32 = 3;
const P_PML_RIGHT: i32 = 4;
const P_PML_BOTTOM: i32 = 5;
const P_PML_TOP: i32 = 6;
const P_PRESSURE: i32 = 7;
const P_VELOCITY_X: i32 = 8;
const P_VELOCITY_Y: i32 = 9;
const P_PML_PRESSURE_X: i32 = 10;
const P_PML_COLUMNS: i32 = 11;
const P_PML_ROWS: i32 = 12;
const P_CELL_GAIN: i32 = 13;
const P_FACE_GAIN_X: i32 = 14;
const P_FACE_GAIN_Y: i32 = 15;
const P_PEAK_PRESSURE: i32 = 16;
const P_PRESSURE_SQUARE_SUM: i32 = 17;
const P_SPECIAL_ROW_START: i32 = 18;
const P_SPECIAL_TARGET: i32 = 19;
const P_SPECIAL_FLUID_CELL: i32 = 20;
const P_SPECIAL_DECAY: i32 = 21;
const P_SPECIAL_GAIN: i32 = 22;
const P_SPECIAL_STATE: i32 = 23;
const P_ZERO_ROW_START: i32 = 24;
const P_ZERO_CELL: i32 = 25;
const P_FLAGS: i32 = 26;
const P_DECAY: i32 = 32;
const P_VELOCITY_GAIN: i32 = 33;
const P_PRESSURE_GAIN: i32 = 34;
const P_FLUSH_PRESSURE: i32 = 35;
const P_FLUSH_VELOCITY: i32 = 36;
const FLAG_HETEROGENEOUS: i32 = 1;
const FLAG_LEVEL_MAPS: i32 = 2;
const FLAG_PML: i32 = 4;

/** The slot numbers in the order of lib/fdtd/kernel-params.ts, then the block's byte offset, for the test that checks they agree. */
export function parameterSlot(k: i32): i32 {
  // A chain of comparisons rather than an array literal: nothing here may allocate.
  if (k == 0) return P_NX;
  if (k == 1) return P_NY;
  if (k == 2) return P_STRIDE;
  if (k == 3) return P_PML_LEFT;
  if (k == 4) return P_PML_RIGHT;
  if (k == 5) return P_PML_BOTTOM;
  if (k == 6) return P_PML_TOP;
  if (k == 7) return P_PRESSURE;
  if (k == 8) return P_VELOCITY_X;
  if (k == 9) return P_VELOCITY_Y;
  if (k == 10) return P_PML_PRESSURE_X;
  if (k == 11) return P_PML_COLUMNS;
  if (k == 12) return P_PML_ROWS;
  if (k == 13) return P_CELL_GAIN;
  if (k == 14) return P_FACE_GAIN_X;
  if (k == 15) return P_FACE_GAIN_Y;
  if (k == 16) return P_PEAK_PRESSURE;
  if (k == 17) return P_PRESSURE_SQUARE_SUM;
  if (k == 18) return P_SPECIAL_ROW_START;
  if (k == 19) return P_SPECIAL_TARGET;
  if (k == 20) return P_SPECIAL_FLUID_CELL;
  if (k == 21) return P_SPECIAL_DECAY;
  if (k == 22) return P_SPECIAL_GAIN;
  if (k == 23) return P_SPECIAL_STATE;
  if (k == 24) return P_ZERO_ROW_START;
  if (k == 25) return P_ZERO_CELL;
  if (k == 26) return P_FLAGS;
  if (k == 27) return P_DECAY;
  if (k == 28) return P_VELOCITY_GAIN;
  if (k == 29) return P_PRESSURE_GAIN;
  if (k == 30) return P_FLUSH_PRESSURE;
  if (k == 31) return P_FLUSH_VELOCITY;
  if (k == 32) return <i32>PARAMS;
  if (k == 33) return FLAG_HETEROGENEOUS;
  if (k == 34) return FLAG_LEVEL_MAPS;
  if (k == 35) return FLAG_PML;
  return -1;
}

function slot(k: i32): i32 {
  return load<i32>(PARAMS + (<usize>k << 2));
}

function slotF(k: i32): f32 {
  return load<f32>(PARAMS + (<usize>k << 2));
}

/** Byte address of float32 element `index` of the buffer. */
function at(index: i32): usize {
  return <usize>index << 2;
}

// ---------------------------------------------------------------------------------------------
// Row kernels; vx, vy, p, px, g are element offsets of a row start; i runs over [i0, i1).

/** vx[i] = decay vx[i] - gain (p[i] - p[i-1]); `g` >= 0: gain per face from a field row instead. */
function velocityX(vx: i32, p: i32, i0: i32, i1: i32, decay: f32, gain: f32, g: i32): void {
  const vA = f32x4.splat(decay);
  const vG = f32x4.splat(gain);
  let i = i0;
  if (g < 0 && decay == 1.0) {
    let pp = at(p + i - 1);
    let vp = at(vx + i);
    const vend = at(vx + i1 - 3);
    const vend2 = at(vx + i1 - 7);
    for (; vp < vend2; vp += 32, pp += 32) {
      const d = f32x4.sub(v128.load(pp, 4), v128.load(pp));
      const x = f32x4.sub(v128.load(vp), f32x4.mul(vG, d));
      const d2 = f32x4.sub(v128.load(pp, 20), v128.load(pp, 16));
      const x2 = f32x4.sub(v128.load(vp, 16), f32x4.mul(vG, d2));
      v128.store(vp, x);
      v128.store(vp, x2, 16);
    }
    for (; vp < vend; vp += 16, pp += 16) {
      const d = f32x4.sub(v128.load(pp, 4), v128.load(pp));
      const x = f32x4.sub(v128.load(vp), f32x4.mul(vG, d));
      v128.store(vp, x);
    }
    i = <i32>((vp >> 2) - <usize>vx);
    for (; i < i1; i++) {
      const x: f32 = load<f32>(at(vx + i)) - gain * (load<f32>(at(p + i)) - load<f32>(at(p + i - 1)));
      store<f32>(at(vx + i), x);
    }
  } else if (g < 0) {
    for (; i + 4 <= i1; i += 4) {
      const d = f32x4.sub(v128.load(at(p + i)), v128.load(at(p + i - 1)));
      const x = f32x4.sub(f32x4.mul(vA, v128.load(at(vx + i))), f32x4.mul(vG, d));
      v128.store(at(vx + i), x);
    }
    for (; i < i1; i++) {
      const x: f32 = decay * load<f32>(at(vx + i)) - gain * (load<f32>(at(p + i)) - load<f32>(at(p + i - 1)));
      store<f32>(at(vx + i), x);
    }
  } else {
    for (; i + 4 <= i1; i += 4) {
      const d = f32x4.sub(v128.load(at(p + i)), v128.load(at(p + i - 1)));
      const x = f32x4.sub(f32x4.mul(vA, v128.load(at(vx + i))), f32x4.mul(v128.load(at(g + i)), d));
      v128.store(at(vx + i), x);
    }
    for (; i < i1; i++) {
      const x: f32 = decay * load<f32>(at(vx + i)) - load<f32>(at(g + i)) * (load<f32>(at(p + i)) - load<f32>(at(p + i - 1)));
      store<f32>(at(vx + i), x);
    }
  }
}

/** vx[i] = decays[i] vx[i] - gains[i] (p[i] - p[i-1]): PML columns. */
function velocityXTable(vx: i32, p: i32, decays: i32, gains: i32, i0: i32, i1: i32): void {
  let i = i0;
  for (; i + 4 <= i1; i += 4) {
    const d = f32x4.sub(v128.load(at(p + i)), v128.load(at(p + i - 1)));
    const x = f32x4.sub(f32x4.mul(v128.load(at(decays + i)), v128.load(at(vx + i))), f32x4.mul(v128.load(at(gains + i)), d));
    v128.store(at(vx + i), x);
  }
  for (; i < i1; i++) {
    const x: f32 = load<f32>(at(decays + i)) * load<f32>(at(vx + i)) - load<f32>(at(gains + i)) * (load<f32>(at(p + i)) - load<f32>(at(p + i - 1)));
    store<f32>(at(vx + i), x);
  }
}

/** vy[i] = decay vy[i] - gain (p[i] - pBelow[i]); `g` >= 0: gain per face from a field row. */
function velocityY(vy: i32, p: i32, pBelow: i32, i0: i32, i1: i32, decay: f32, gain: f32, g: i32): void {
  const vA = f32x4.splat(decay);
  const vG = f32x4.splat(gain);
  let i = i0;
  if (g < 0 && decay == 1.0) {
    const off = at(pBelow) - at(p);
    const voff = at(vy) - at(p);
    let pp = at(p + i);
    const pend = at(p + i1 - 3);
    const pend2 = at(p + i1 - 7);
    for (; pp < pend2; pp += 32) {
      const d = f32x4.sub(v128.load(pp), v128.load(pp + off));
      const x = f32x4.sub(v128.load(pp + voff), f32x4.mul(vG, d));
      const d2 = f32x4.sub(v128.load(pp, 16), v128.load(pp + off, 16));
      const x2 = f32x4.sub(v128.load(pp + voff, 16), f32x4.mul(vG, d2));
      v128.store(pp + voff, x);
      v128.store(pp + voff, x2, 16);
    }
    for (; pp < pend; pp += 16) {
      const d = f32x4.sub(v128.load(pp), v128.load(pp + off));
      const x = f32x4.sub(v128.load(pp + voff), f32x4.mul(vG, d));
      v128.store(pp + voff, x);
    }
    i = <i32>((pp >> 2) - <usize>p);
    for (; i < i1; i++) {
      const x: f32 = load<f32>(at(vy + i)) - gain * (load<f32>(at(p + i)) - load<f32>(at(pBelow + i)));
      store<f32>(at(vy + i), x);
    }
  } else if (g < 0) {
    for (; i + 4 <= i1; i += 4) {
      const d = f32x4.sub(v128.load(at(p + i)), v128.load(at(pBelow + i)));
      const x = f32x4.sub(f32x4.mul(vA, v128.load(at(vy + i))), f32x4.mul(vG, d));
      v128.store(at(vy + i), x);
    }
    for (; i < i1; i++) {
      const x: f32 = decay * load<f32>(at(vy + i)) - gain * (load<f32>(at(p + i)) - load<f32>(at(pBelow + i)));
      store<f32>(at(vy + i), x);
    }
  } else {
    for (; i + 4 <= i1; i += 4) {
      const d = f32x4.sub(v128.load(at(p + i)), v128.load(at(pBelow + i)));
      const x = f32x4.sub(f32x4.mul(vA, v128.load(at(vy + i))), f32x4.mul(v128.load(at(g + i)), d));
      v128.store(at(vy + i), x);
    }
    for (; i < i1; i++) {
      const x: f32 = decay * load<f32>(at(vy + i)) - load<f32>(at(g + i)) * (load<f32>(at(p + i)) - load<f32>(at(pBelow + i)));
      store<f32>(at(vy + i), x);
    }
  }
}

/** p[i] = decay p[i] - gain (vx[i+1] - vx[i] + vyAbove[i] - vy[i]); `g` >= 0: gain per cell from a field row. */
function pressure(p: i32, vx: i32, vy: i32, vyAbove: i32, i0: i32, i1: i32, decay: f32, gain: f32, g: i32): void {
  const vA = f32x4.splat(decay);
  const vG = f32x4.splat(gain);
  let i = i0;
  if (g < 0 && decay == 1.0) {
    const ox = at(vx) - at(p);
    const oy = at(vy) - at(p);
    const oya = at(vyAbove) - at(p);
    let pp = at(p + i);
    const pend = at(p + i1 - 3);
    const pend2 = at(p + i1 - 7);
    for (; pp < pend2; pp += 32) {
      const div = f32x4.add(f32x4.sub(v128.load(pp + ox, 4), v128.load(pp + ox)), f32x4.sub(v128.load(pp + oya), v128.load(pp + oy)));
      const x = f32x4.sub(v128.load(pp), f32x4.mul(vG, div));
      const div2 = f32x4.add(f32x4.sub(v128.load(pp + ox, 20), v128.load(pp + ox, 16)), f32x4.sub(v128.load(pp + oya, 16), v128.load(pp + oy, 16)));
      const x2 = f32x4.sub(v128.load(pp, 16), f32x4.mul(vG, div2));
      v128.store(pp, x);
      v128.store(pp, x2, 16);
    }
    for (; pp < pend; pp += 16) {
      const div = f32x4.add(f32x4.sub(v128.load(pp + ox, 4), v128.load(pp + ox)), f32x4.sub(v128.load(pp + oya), v128.load(pp + oy)));
      const x = f32x4.sub(v128.load(pp), f32x4.mul(vG, div));
      v128.store(pp, x);
    }
    i = <i32>((pp >> 2) - <usize>p);
    for (; i < i1; i++) {
      const div: f32 = (load<f32>(at(vx + i + 1)) - load<f32>(at(vx + i))) + (load<f32>(at(vyAbove + i)) - load<f32>(at(vy + i)));
      const x: f32 = load<f32>(at(p + i)) - gain * div;
      store<f32>(at(p + i), x);
    }
  } else if (g < 0) {
    for (; i + 4 <= i1; i += 4) {
      const div = f32x4.add(f32x4.sub(v128.load(at(vx + i + 1)), v128.load(at(vx + i))), f32x4.sub(v128.load(at(vyAbove + i)), v128.load(at(vy + i))));
      const x = f32x4.sub(f32x4.mul(vA, v128.load(at(p + i))), f32x4.mul(vG, div));
      v128.store(at(p + i), x);
    }
    for (; i < i1; i++) {
      const div: f32 = (load<f32>(at(vx + i + 1)) - load<f32>(at(vx + i))) + (load<f32>(at(vyAbove + i)) - load<f32>(at(vy + i)));
      const x: f32 = decay * load<f32>(at(p + i)) - gain * div;
      store<f32>(at(p + i), x);
    }
  } else {
    for (; i + 4 <= i1; i += 4) {
      const div = f32x4.add(f32x4.sub(v128.load(at(vx + i + 1)), v128.load(at(vx + i))), f32x4.sub(v128.load(at(vyAbove + i)), v128.load(at(vy + i))));
      const x = f32x4.sub(f32x4.mul(vA, v128.load(at(p + i))), f32x4.mul(v128.load(at(g + i)), div));
      v128.store(at(p + i), x);
    }
    for (; i < i1; i++) {
      const div: f32 = (load<f32>(at(vx + i + 1)) - load<f32>(at(vx + i))) + (load<f32>(at(vyAbove + i)) - load<f32>(at(vy + i)));
      const x: f32 = decay * load<f32>(at(p + i)) - load<f32>(at(g + i)) * div;
      store<f32>(at(p + i), x);
    }
  }
}

/** Split-field PML cells: px = ax px - bx dvx, py = ay py - by dvy, py = p - px, p = px + py. */
function pressureSplit(p: i32, px: i32, vx: i32, vy: i32, vyAbove: i32, ax: i32, bx: i32, i0: i32, i1: i32, ay: f32, by: f32): void {
  const vAy = f32x4.splat(ay);
  const vBy = f32x4.splat(by);
  let i = i0;
  for (; i + 4 <= i1; i += 4) {
    const oldX = v128.load(at(px + i));
    const oldY = f32x4.sub(v128.load(at(p + i)), oldX);
    const newX = f32x4.sub(f32x4.mul(v128.load(at(ax + i)), oldX), f32x4.mul(v128.load(at(bx + i)), f32x4.sub(v128.load(at(vx + i + 1)), v128.load(at(vx + i)))));
    const newY = f32x4.sub(f32x4.mul(vAy, oldY), f32x4.mul(vBy, f32x4.sub(v128.load(at(vyAbove + i)), v128.load(at(vy + i)))));
    v128.store(at(px + i), newX);
    v128.store(at(p + i), f32x4.add(newX, newY));
  }
  for (; i < i1; i++) {
    const oldX = load<f32>(at(px + i));
    const oldY: f32 = load<f32>(at(p + i)) - oldX;
    const newX: f32 = load<f32>(at(ax + i)) * oldX - load<f32>(at(bx + i)) * (load<f32>(at(vx + i + 1)) - load<f32>(at(vx + i)));
    const newY: f32 = ay * oldY - by * (load<f32>(at(vyAbove + i)) - load<f32>(at(vy + i)));
    store<f32>(at(px + i), newX);
    store<f32>(at(p + i), newX + newY);
  }
}

/** Running peak |p| (float32) and sum of p^2 (float64; `sum` is a Float64 element offset) over a row. */
function accumulateLevels(p: i32, peak: i32, sum: i32, count: i32): void {
  let i = 0;
  for (; i + 4 <= count; i += 4) {
    const v = v128.load(at(p + i));
    v128.store(at(peak + i), f32x4.max(v128.load(at(peak + i)), f32x4.abs(v)));
    const lo = f64x2.promote_low_f32x4(v);
    const hi = f64x2.promote_low_f32x4(v128.shuffle<f32>(v, v, 2, 3, 2, 3));
    const s = <usize>(sum + i) << 3;
    v128.store(s, f64x2.add(v128.load(s), f64x2.mul(lo, lo)));
    v128.store(s + 16, f64x2.add(v128.load(s + 16), f64x2.mul(hi, hi)));
  }
  for (; i < count; i++) {
    const value = load<f32>(at(p + i));
    const magnitude = Mathf.abs(value);
    if (magnitude > load<f32>(at(peak + i))) store<f32>(at(peak + i), magnitude);
    const s = <usize>(sum + i) << 3;
    const wide = <f64>value;
    store<f64>(s, load<f64>(s) + wide * wide);
  }
}

// ---------------------------------------------------------------------------------------------
// Sweep (mirrors lib/fdtd/kernel.ts)

function velocityRow(j: i32): void {
  const nx = slot(P_NX);
  const ny = slot(P_NY);
  const stride = slot(P_STRIDE);
  const decay = slotF(P_DECAY);
  const gain = slotF(P_VELOCITY_GAIN);
  const heterogeneous = (slot(P_FLAGS) & FLAG_HETEROGENEOUS) != 0;
  const cols = slot(P_PML_COLUMNS);
  const rows = slot(P_PML_ROWS);
  const colFaceDecay = cols + 2 * stride;
  const colFaceGain = cols + 3 * stride;
  const vx = slot(P_VELOCITY_X) + j * stride;
  const p = slot(P_PRESSURE) + j * stride;
  const pmlRight = slot(P_PML_RIGHT);
  const pmlRow = j < slot(P_PML_BOTTOM) || j >= ny - slot(P_PML_TOP);
  if (pmlRow) {
    // Columns between the side PMLs have no x damping: the uniform path gives the same numbers, faster.
    const pmlLeft = slot(P_PML_LEFT);
    const iL = pmlLeft > 1 ? pmlLeft : 1;
    const iR = pmlRight > 0 ? nx - pmlRight + 1 : nx;
    if (iL > 1) velocityXTable(vx, p, colFaceDecay, colFaceGain, 1, iL);
    velocityX(vx, p, iL, iR, decay, gain, -1);
    if (iR < nx) velocityXTable(vx, p, colFaceDecay, colFaceGain, iR, nx);
  } else {
    const pmlLeft = slot(P_PML_LEFT);
    const iL = pmlLeft > 1 ? pmlLeft : 1;
    const iR = pmlRight > 0 ? nx - pmlRight + 1 : nx;
    if (iL > 1) velocityXTable(vx, p, colFaceDecay, colFaceGain, 1, iL);
    velocityX(vx, p, iL, iR, decay, gain, heterogeneous ? slot(P_FACE_GAIN_X) + j * stride : -1);
    if (iR < nx) velocityXTable(vx, p, colFaceDecay, colFaceGain, iR, nx);
  }
  if (j >= 1) {
    const vy = slot(P_VELOCITY_Y) + j * stride;
    if (pmlRow) {
      const rowFaceDecay = rows + 2 * (ny + 1);
      const rowFaceGain = rows + 3 * (ny + 1);
      velocityY(vy, p, p - stride, 0, nx, load<f32>(at(rowFaceDecay + j)), load<f32>(at(rowFaceGain + j)), -1);
    } else {
      velocityY(vy, p, p - stride, 0, nx, decay, gain, heterogeneous ? slot(P_FACE_GAIN_Y) + j * stride : -1);
    }
  }
}

function boundaryFaces(j: i32): void {
  const rowStart = slot(P_SPECIAL_ROW_START);
  const target = slot(P_SPECIAL_TARGET);
  const fluid = slot(P_SPECIAL_FLUID_CELL);
  const decays = slot(P_SPECIAL_DECAY);
  const gains = slot(P_SPECIAL_GAIN);
  const state = slot(P_SPECIAL_STATE);
  const start = load<i32>(at(rowStart + j));
  const end = load<i32>(at(rowStart + j + 1));
  for (let s = start; s < end; s++) {
    const v: f32 = load<f32>(at(decays + s)) * load<f32>(at(state + s)) + load<f32>(at(gains + s)) * load<f32>(at(load<i32>(at(fluid + s))));
    store<f32>(at(state + s), v);
    store<f32>(at(load<i32>(at(target + s))), v);
  }
}

function pressureRow(j: i32): void {
  const nx = slot(P_NX);
  const ny = slot(P_NY);
  const stride = slot(P_STRIDE);
  const flags = slot(P_FLAGS);
  const decay = slotF(P_DECAY);
  const gain = slotF(P_PRESSURE_GAIN);
  const p = slot(P_PRESSURE) + j * stride;
  const vx = slot(P_VELOCITY_X) + j * stride;
  const vy = slot(P_VELOCITY_Y) + j * stride;
  const vyAbove = vy + stride;
  if ((flags & FLAG_LEVEL_MAPS) != 0) accumulateLevels(p, slot(P_PEAK_PRESSURE) + j * stride, slot(P_PRESSURE_SQUARE_SUM) + j * stride, nx);
  const cols = slot(P_PML_COLUMNS);
  const rows = slot(P_PML_ROWS);
  const px = slot(P_PML_PRESSURE_X) + j * stride;
  const pmlRow = j < slot(P_PML_BOTTOM) || j >= ny - slot(P_PML_TOP);
  if (pmlRow) {
    pressureSplit(p, px, vx, vy, vyAbove, cols, cols + stride, 0, nx, load<f32>(at(rows + j)), load<f32>(at(rows + (ny + 1) + j)));
  } else {
    const iL = slot(P_PML_LEFT);
    const iR = nx - slot(P_PML_RIGHT);
    if (iL > 0) pressureSplit(p, px, vx, vy, vyAbove, cols, cols + stride, 0, iL, decay, gain);
    pressure(p, vx, vy, vyAbove, iL, iR, decay, gain, (flags & FLAG_HETEROGENEOUS) != 0 ? slot(P_CELL_GAIN) + j * stride : -1);
    if (iR < nx) pressureSplit(p, px, vx, vy, vyAbove, cols, cols + stride, iR, nx, decay, gain);
  }
  const zeroRowStart = slot(P_ZERO_ROW_START);
  const zeroCell = slot(P_ZERO_CELL);
  const pressureBase = slot(P_PRESSURE);
  const hasPml = (flags & FLAG_PML) != 0;
  const pmlBase = slot(P_PML_PRESSURE_X);
  const start = load<i32>(at(zeroRowStart + j));
  const end = load<i32>(at(zeroRowStart + j + 1));
  for (let s = start; s < end; s++) {
    const cell = load<i32>(at(zeroCell + s));
    store<f32>(at(pressureBase + cell), 0);
    if (hasPml) store<f32>(at(pmlBase + cell), 0);
  }
}

/** Phase 1 of a step for rows [y0, y1): velocity rows with their boundary faces, pressure rows [y0, y1 - 1). */
export function sweepStrip(y0: i32, y1: i32): void {
  for (let j = y0; j < y1; j++) {
    velocityRow(j);
    boundaryFaces(j);
    if (j > y0) pressureRow(j - 1);
  }
}

/** Phase 2: pressure row y1 - 1, once the strip above has swept. */
export function finishStrip(y0: i32, y1: i32): void {
  if (y1 > y0) pressureRow(y1 - 1);
}

/** x = (x + F) - F over `count` floats from element `start`: tiny values to zero, the rest to the quantum. */
function flushRow(start: i32, count: i32, flush: f32): void {
  const vF = f32x4.splat(flush);
  let i = 0;
  for (; i + 4 <= count; i += 4) v128.store(at(start + i), f32x4.sub(f32x4.add(v128.load(at(start + i)), vF), vF));
  for (; i < count; i++) store<f32>(at(start + i), (load<f32>(at(start + i)) + flush) - flush);
}

/** Flushes rows [y0, y1) of every field, and the top y-velocity row with the last strip (after phase 2). */
export function flushStrip(y0: i32, y1: i32): void {
  const nx = slot(P_NX);
  const ny = slot(P_NY);
  const stride = slot(P_STRIDE);
  const flushP = slotF(P_FLUSH_PRESSURE);
  const flushV = slotF(P_FLUSH_VELOCITY);
  const hasPml = (slot(P_FLAGS) & FLAG_PML) != 0;
  for (let j = y0; j < y1; j++) {
    flushRow(slot(P_PRESSURE) + j * stride, nx, flushP);
    if (hasPml) flushRow(slot(P_PML_PRESSURE_X) + j * stride, nx, flushP);
    flushRow(slot(P_VELOCITY_X) + j * stride, nx + 1, flushV);
    flushRow(slot(P_VELOCITY_Y) + j * stride, nx, flushV);
  }
  if (y1 == ny && y1 > y0) flushRow(slot(P_VELOCITY_Y) + ny * stride, nx, flushV);
}
