// @ts-nocheck -- AssemblyScript source (f32, v128, load/store builtins), compiled by scripts/fdtd-build-wasm.ts, not by tsc.
/* eslint-disable */
//
// The WebAssembly SIMD kernel: the same sweep as lib/fdtd/kernel.ts (the reference), on the same state
// layout and parameter block, computing in float32 with the same operations on the same inputs, so that
// the fields are bit-identical. Four cells per 128-bit vector along a row (i runs fastest). Memory is
// imported: the caller lays the state out in it (lib/fdtd/layout.ts).
//
// One step, with a = decay, gv = velocity gain dt/(rho h), gp = pressure gain rho c^2 dt / h:
//   vx[j][i] = a vx[j][i] - gv (p[j][i] - p[j][i-1]),  vy[j][i] = a vy[j][i] - gv (p[j][i] - p[j-1][i])
//   p[j][i]  = a p[j][i]  - gp (vx[j][i+1] - vx[j][i] + vy[j+1][i] - vy[j][i])
// Every few steps flushStrip passes each stored value through (x + F) - F, which zeroes float32
// subnormals (slow on x86; WebAssembly has no flush-to-zero mode).
//
// Why the code is shaped as it is (measured on 1024^2 with a 20-cell PML, where the sweep is bound by
// memory traffic and by the number of instructions per cell):
// - Velocity row j and pressure row j-1 are updated in one pass along the row wherever row j has no
//   boundary face and the medium is uniform (fusedRow): each p, vx, vy vector is loaded once for every
//   update that needs it, one pass over six rows instead of three loops over nine. This alone gave
//   about 1.5x.
//   The pass runs as three spans, left PML columns / the columns between / right PML columns, each a
//   vector loop with its own coefficients and a scalar end; the bottom and top PML rows have their own
//   span kernels, so no row of the usual free-field grid goes through the separate row kernels.
// - The separate row kernels (velocityRow, boundaryFaces, pressureRow) remain for rows with boundary
//   faces, medium regions, the first row of a strip and the last (finishStrip); they are the
//   reference's loops one for one.
// - Loops walk byte pointers, with the distances between the arrays as loop-invariant offsets.
// - The split pressure px is packed (layout.ts): the side-PML cells of consecutive rows share cache
//   lines instead of touching one scattered line per row.
// - Tried and dropped (no gain measurable on the shared 2-core test machine): one pointer per array
//   instead of offsets, reusing the previous vector through shuffles instead of the unaligned p[i-1]
//   and vx[i+1] loads, rows padded to 64 bytes. Padding rows so that row j and row j-1 differ by 512
//   bytes modulo 4 KiB (against store/load address aliasing) was 17% slower: the padding is streamed
//   through the caches too.

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

// ---------------------------------------------------------------------------------------------
// Parameters, read from the block once per exported call into globals (each worker has its own
// instance, so these are per thread).

let nx: i32 = 0;
let ny: i32 = 0;
let stride: i32 = 0;
let pmlLeft: i32 = 0;
let pmlRight: i32 = 0;
let pmlBottom: i32 = 0;
let pmlTop: i32 = 0;
/** Packed side rows of px: offset of the right part, and floats per row (layout.ts, pmlSideRowWidth). */
let sideLeft: i32 = 0;
let sideWidth: i32 = 0;
let pressureBase: i32 = 0;
let velocityXBase: i32 = 0;
let velocityYBase: i32 = 0;
let pmlBase: i32 = 0;
let pmlColumns: i32 = 0;
let pmlRows: i32 = 0;
let cellGainBase: i32 = 0;
let faceGainXBase: i32 = 0;
let faceGainYBase: i32 = 0;
let peakBase: i32 = 0;
let squareSumBase: i32 = 0;
let specialRowStart: i32 = 0;
let zeroRowStart: i32 = 0;
let heterogeneous: bool = false;
let levelMaps: bool = false;
let hasPml: bool = false;
let decay: f32 = 1;
let velocityGain: f32 = 0;
let pressureGain: f32 = 0;

function slot(k: i32): i32 {
  return load<i32>(PARAMS + (<usize>k << 2));
}

function slotF(k: i32): f32 {
  return load<f32>(PARAMS + (<usize>k << 2));
}

function readParams(): void {
  nx = slot(P_NX);
  ny = slot(P_NY);
  stride = slot(P_STRIDE);
  pmlLeft = slot(P_PML_LEFT);
  pmlRight = slot(P_PML_RIGHT);
  pmlBottom = slot(P_PML_BOTTOM);
  pmlTop = slot(P_PML_TOP);
  sideLeft = (pmlLeft + 3) & ~3;
  sideWidth = sideLeft + ((pmlRight + 3) & ~3);
  pressureBase = slot(P_PRESSURE);
  velocityXBase = slot(P_VELOCITY_X);
  velocityYBase = slot(P_VELOCITY_Y);
  pmlBase = slot(P_PML_PRESSURE_X);
  pmlColumns = slot(P_PML_COLUMNS);
  pmlRows = slot(P_PML_ROWS);
  cellGainBase = slot(P_CELL_GAIN);
  faceGainXBase = slot(P_FACE_GAIN_X);
  faceGainYBase = slot(P_FACE_GAIN_Y);
  peakBase = slot(P_PEAK_PRESSURE);
  squareSumBase = slot(P_PRESSURE_SQUARE_SUM);
  specialRowStart = slot(P_SPECIAL_ROW_START);
  zeroRowStart = slot(P_ZERO_ROW_START);
  const flags = slot(P_FLAGS);
  heterogeneous = (flags & FLAG_HETEROGENEOUS) != 0;
  levelMaps = (flags & FLAG_LEVEL_MAPS) != 0;
  hasPml = (flags & FLAG_PML) != 0;
  decay = slotF(P_DECAY);
  velocityGain = slotF(P_VELOCITY_GAIN);
  pressureGain = slotF(P_PRESSURE_GAIN);
}

/** Byte address of float32 element `index` of the buffer. */
// @ts-ignore: decorator
@inline function at(index: i32): usize {
  return <usize>index << 2;
}

function isPmlRow(j: i32): bool {
  return j < pmlBottom || j >= ny - pmlTop;
}

/** Element offset of row j of the packed px (lib/fdtd/layout.ts, pmlPressureXRow). */
function pmlRowOffset(j: i32): i32 {
  if (j < pmlBottom) return pmlBase + j * stride;
  if (j < ny - pmlTop) return pmlBase + pmlBottom * stride + (j - pmlBottom) * sideWidth;
  return pmlBase + pmlBottom * stride + (ny - pmlBottom - pmlTop) * sideWidth + (j - (ny - pmlTop)) * stride;
}

// ---------------------------------------------------------------------------------------------
// Row kernels. Arguments are byte addresses of a row start (vx, vy, p, px, tables); i runs over
// [i0, i1). Vector loops first, then a scalar tail; the scalar lines are the reference's equations.

/** vx[i] = decay vx[i] - gain (p[i] - p[i-1]), scalar decay and gain (uniform medium). */
function velocityXUniform(vx: usize, p: usize, i0: i32, i1: i32, decay: f32, gain: f32): void {
  const vA = f32x4.splat(decay);
  const vG = f32x4.splat(gain);
  const dp = p - vx;
  let v = vx + (<usize>i0 << 2);
  const end = vx + (<usize>i1 << 2);
  if (decay == 1.0) {
    // Lossless: 1 * vx is vx exactly, so the multiplication is left out.
    for (; v + 32 <= end; v += 32) {
      const x = f32x4.sub(v128.load(v), f32x4.mul(vG, f32x4.sub(v128.load(v + dp), v128.load(v + dp - 4))));
      const x2 = f32x4.sub(v128.load(v, 16), f32x4.mul(vG, f32x4.sub(v128.load(v + dp, 16), v128.load(v + dp, 12))));
      v128.store(v, x);
      v128.store(v, x2, 16);
    }
    for (; v + 16 <= end; v += 16) {
      v128.store(v, f32x4.sub(v128.load(v), f32x4.mul(vG, f32x4.sub(v128.load(v + dp), v128.load(v + dp - 4)))));
    }
    for (; v < end; v += 4) {
      store<f32>(v, load<f32>(v) - gain * (load<f32>(v + dp) - load<f32>(v + dp - 4)));
    }
  } else {
    for (; v + 16 <= end; v += 16) {
      v128.store(v, f32x4.sub(f32x4.mul(vA, v128.load(v)), f32x4.mul(vG, f32x4.sub(v128.load(v + dp), v128.load(v + dp - 4)))));
    }
    for (; v < end; v += 4) {
      store<f32>(v, decay * load<f32>(v) - gain * (load<f32>(v + dp) - load<f32>(v + dp - 4)));
    }
  }
}

/** As velocityXUniform with the gain per face from a gain-field row `g` (medium regions). */
function velocityXField(vx: usize, p: usize, g: usize, i0: i32, i1: i32, decay: f32): void {
  const vA = f32x4.splat(decay);
  const dp = p - vx;
  const dg = g - vx;
  let v = vx + (<usize>i0 << 2);
  const end = vx + (<usize>i1 << 2);
  for (; v + 16 <= end; v += 16) {
    v128.store(v, f32x4.sub(f32x4.mul(vA, v128.load(v)), f32x4.mul(v128.load(v + dg), f32x4.sub(v128.load(v + dp), v128.load(v + dp - 4)))));
  }
  for (; v < end; v += 4) {
    store<f32>(v, decay * load<f32>(v) - load<f32>(v + dg) * (load<f32>(v + dp) - load<f32>(v + dp - 4)));
  }
}

/** vx[i] = decays[i] vx[i] - gains[i] (p[i] - p[i-1]): side-PML faces, per-column tables. */
function velocityXTable(vx: usize, p: usize, decays: usize, gains: usize, i0: i32, i1: i32): void {
  const dp = p - vx;
  const da = decays - vx;
  const dg = gains - vx;
  let v = vx + (<usize>i0 << 2);
  const end = vx + (<usize>i1 << 2);
  for (; v + 16 <= end; v += 16) {
    v128.store(v, f32x4.sub(f32x4.mul(v128.load(v + da), v128.load(v)), f32x4.mul(v128.load(v + dg), f32x4.sub(v128.load(v + dp), v128.load(v + dp - 4)))));
  }
  for (; v < end; v += 4) {
    store<f32>(v, load<f32>(v + da) * load<f32>(v) - load<f32>(v + dg) * (load<f32>(v + dp) - load<f32>(v + dp - 4)));
  }
}

/** vy[i] = decay vy[i] - gain (p[i] - pBelow[i]), scalar decay and gain. */
function velocityYUniform(vy: usize, p: usize, pBelow: usize, i0: i32, i1: i32, decay: f32, gain: f32): void {
  const vA = f32x4.splat(decay);
  const vG = f32x4.splat(gain);
  const dp = p - vy;
  const db = pBelow - vy;
  let v = vy + (<usize>i0 << 2);
  const end = vy + (<usize>i1 << 2);
  if (decay == 1.0) {
    for (; v + 32 <= end; v += 32) {
      const x = f32x4.sub(v128.load(v), f32x4.mul(vG, f32x4.sub(v128.load(v + dp), v128.load(v + db))));
      const x2 = f32x4.sub(v128.load(v, 16), f32x4.mul(vG, f32x4.sub(v128.load(v + dp, 16), v128.load(v + db, 16))));
      v128.store(v, x);
      v128.store(v, x2, 16);
    }
    for (; v + 16 <= end; v += 16) {
      v128.store(v, f32x4.sub(v128.load(v), f32x4.mul(vG, f32x4.sub(v128.load(v + dp), v128.load(v + db)))));
    }
    for (; v < end; v += 4) {
      store<f32>(v, load<f32>(v) - gain * (load<f32>(v + dp) - load<f32>(v + db)));
    }
  } else {
    for (; v + 16 <= end; v += 16) {
      v128.store(v, f32x4.sub(f32x4.mul(vA, v128.load(v)), f32x4.mul(vG, f32x4.sub(v128.load(v + dp), v128.load(v + db)))));
    }
    for (; v < end; v += 4) {
      store<f32>(v, decay * load<f32>(v) - gain * (load<f32>(v + dp) - load<f32>(v + db)));
    }
  }
}

/** As velocityYUniform with the gain per face from a gain-field row `g`. */
function velocityYField(vy: usize, p: usize, pBelow: usize, g: usize, i0: i32, i1: i32, decay: f32): void {
  const vA = f32x4.splat(decay);
  const dp = p - vy;
  const db = pBelow - vy;
  const dg = g - vy;
  let v = vy + (<usize>i0 << 2);
  const end = vy + (<usize>i1 << 2);
  for (; v + 16 <= end; v += 16) {
    v128.store(v, f32x4.sub(f32x4.mul(vA, v128.load(v)), f32x4.mul(v128.load(v + dg), f32x4.sub(v128.load(v + dp), v128.load(v + db)))));
  }
  for (; v < end; v += 4) {
    store<f32>(v, decay * load<f32>(v) - load<f32>(v + dg) * (load<f32>(v + dp) - load<f32>(v + db)));
  }
}

/** p[i] = decay p[i] - gain (vx[i+1] - vx[i] + vyAbove[i] - vy[i]), scalar decay and gain. */
function pressureUniform(p: usize, vx: usize, vy: usize, vyAbove: usize, i0: i32, i1: i32, decay: f32, gain: f32): void {
  const vA = f32x4.splat(decay);
  const vG = f32x4.splat(gain);
  const dx = vx - p;
  const dy = vy - p;
  const da = vyAbove - p;
  let q = p + (<usize>i0 << 2);
  const end = p + (<usize>i1 << 2);
  if (decay == 1.0) {
    for (; q + 32 <= end; q += 32) {
      const div = f32x4.add(f32x4.sub(v128.load(q + dx, 4), v128.load(q + dx)), f32x4.sub(v128.load(q + da), v128.load(q + dy)));
      const div2 = f32x4.add(f32x4.sub(v128.load(q + dx, 20), v128.load(q + dx, 16)), f32x4.sub(v128.load(q + da, 16), v128.load(q + dy, 16)));
      v128.store(q, f32x4.sub(v128.load(q), f32x4.mul(vG, div)));
      v128.store(q, f32x4.sub(v128.load(q, 16), f32x4.mul(vG, div2)), 16);
    }
    for (; q + 16 <= end; q += 16) {
      const div = f32x4.add(f32x4.sub(v128.load(q + dx, 4), v128.load(q + dx)), f32x4.sub(v128.load(q + da), v128.load(q + dy)));
      v128.store(q, f32x4.sub(v128.load(q), f32x4.mul(vG, div)));
    }
    for (; q < end; q += 4) {
      const div: f32 = (load<f32>(q + dx, 4) - load<f32>(q + dx)) + (load<f32>(q + da) - load<f32>(q + dy));
      store<f32>(q, load<f32>(q) - gain * div);
    }
  } else {
    for (; q + 16 <= end; q += 16) {
      const div = f32x4.add(f32x4.sub(v128.load(q + dx, 4), v128.load(q + dx)), f32x4.sub(v128.load(q + da), v128.load(q + dy)));
      v128.store(q, f32x4.sub(f32x4.mul(vA, v128.load(q)), f32x4.mul(vG, div)));
    }
    for (; q < end; q += 4) {
      const div: f32 = (load<f32>(q + dx, 4) - load<f32>(q + dx)) + (load<f32>(q + da) - load<f32>(q + dy));
      store<f32>(q, decay * load<f32>(q) - gain * div);
    }
  }
}

/** As pressureUniform with the gain per cell from a gain-field row `g`. */
function pressureField(p: usize, vx: usize, vy: usize, vyAbove: usize, g: usize, i0: i32, i1: i32, decay: f32): void {
  const vA = f32x4.splat(decay);
  const dx = vx - p;
  const dy = vy - p;
  const da = vyAbove - p;
  const dg = g - p;
  let q = p + (<usize>i0 << 2);
  const end = p + (<usize>i1 << 2);
  for (; q + 16 <= end; q += 16) {
    const div = f32x4.add(f32x4.sub(v128.load(q + dx, 4), v128.load(q + dx)), f32x4.sub(v128.load(q + da), v128.load(q + dy)));
    v128.store(q, f32x4.sub(f32x4.mul(vA, v128.load(q)), f32x4.mul(v128.load(q + dg), div)));
  }
  for (; q < end; q += 4) {
    const div: f32 = (load<f32>(q + dx, 4) - load<f32>(q + dx)) + (load<f32>(q + da) - load<f32>(q + dy));
    store<f32>(q, decay * load<f32>(q) - load<f32>(q + dg) * div);
  }
}

/**
 * Split-field PML cells: px = ax[i] px - bx[i] dvx, py = ay py - by dvy with py = p - px, then
 * p = px + py. `ax`, `bx` are column tables (byte addresses of element 0), ay, by this row's scalars.
 */
function pressureSplit(p: usize, px: usize, vx: usize, vy: usize, vyAbove: usize, ax: usize, bx: usize, i0: i32, i1: i32, ay: f32, by: f32): void {
  const vAy = f32x4.splat(ay);
  const vBy = f32x4.splat(by);
  const dpx = px - p;
  const dx = vx - p;
  const dy = vy - p;
  const da = vyAbove - p;
  const dax = ax - p;
  const dbx = bx - p;
  let q = p + (<usize>i0 << 2);
  const end = p + (<usize>i1 << 2);
  for (; q + 16 <= end; q += 16) {
    const oldX = v128.load(q + dpx);
    const oldY = f32x4.sub(v128.load(q), oldX);
    const newX = f32x4.sub(f32x4.mul(v128.load(q + dax), oldX), f32x4.mul(v128.load(q + dbx), f32x4.sub(v128.load(q + dx, 4), v128.load(q + dx))));
    const newY = f32x4.sub(f32x4.mul(vAy, oldY), f32x4.mul(vBy, f32x4.sub(v128.load(q + da), v128.load(q + dy))));
    v128.store(q + dpx, newX);
    v128.store(q, f32x4.add(newX, newY));
  }
  for (; q < end; q += 4) {
    const oldX = load<f32>(q + dpx);
    const oldY: f32 = load<f32>(q) - oldX;
    const newX: f32 = load<f32>(q + dax) * oldX - load<f32>(q + dbx) * (load<f32>(q + dx, 4) - load<f32>(q + dx));
    const newY: f32 = ay * oldY - by * (load<f32>(q + da) - load<f32>(q + dy));
    store<f32>(q + dpx, newX);
    store<f32>(q, newX + newY);
  }
}

/** As pressureSplit with scalar ax, bx: bottom and top PML rows between the side PMLs. */
function pressureSplitUniformX(p: usize, px: usize, vx: usize, vy: usize, vyAbove: usize, i0: i32, i1: i32, ax: f32, bx: f32, ay: f32, by: f32): void {
  const vAx = f32x4.splat(ax);
  const vBx = f32x4.splat(bx);
  const vAy = f32x4.splat(ay);
  const vBy = f32x4.splat(by);
  const dpx = px - p;
  const dx = vx - p;
  const dy = vy - p;
  const da = vyAbove - p;
  let q = p + (<usize>i0 << 2);
  const end = p + (<usize>i1 << 2);
  for (; q + 16 <= end; q += 16) {
    const oldX = v128.load(q + dpx);
    const oldY = f32x4.sub(v128.load(q), oldX);
    const newX = f32x4.sub(f32x4.mul(vAx, oldX), f32x4.mul(vBx, f32x4.sub(v128.load(q + dx, 4), v128.load(q + dx))));
    const newY = f32x4.sub(f32x4.mul(vAy, oldY), f32x4.mul(vBy, f32x4.sub(v128.load(q + da), v128.load(q + dy))));
    v128.store(q + dpx, newX);
    v128.store(q, f32x4.add(newX, newY));
  }
  for (; q < end; q += 4) {
    const oldX = load<f32>(q + dpx);
    const oldY: f32 = load<f32>(q) - oldX;
    const newX: f32 = ax * oldX - bx * (load<f32>(q + dx, 4) - load<f32>(q + dx));
    const newY: f32 = ay * oldY - by * (load<f32>(q + da) - load<f32>(q + dy));
    store<f32>(q + dpx, newX);
    store<f32>(q, newX + newY);
  }
}

// Fused spans: velocity row j and pressure row j-1 in one pass over the cells [i0, i1). `p` is the byte
// address of pressure row j; the other rows sit at fixed byte offsets from it: toVx, toVy to vx[j][i],
// vy[j][i], rowBytes back to row j-1, toPx to px[j-1][i]. For each cell i, in this order:
//   vx[j][i] = a vx - gv (p[j][i] - p[j][i-1])
//   vy[j][i] = ay vy - gy (p[j][i] - p[j-1][i])          (reads the old p[j-1][i] ...)
//   p[j-1][i] = ap p - gp (vx[j-1][i+1] - vx[j-1][i] + vy[j][i] - vy[j-1][i])   (... then overwrites it)
// which are the reference's row updates, cell by cell: nothing else reads the old p[j-1][i] once vy[j][i]
// is known (vx[j-1] and vy[j-1] were done with the previous row). The face i = 0 of a span starting at
// cell 0 is computed too (from p[j][-1], the previous row's padding) and restored by the caller, so
// that no span needs a peeled first vector. Each span ends in scalar cells with the same equations.

/** Lossless interior span (a = ay = ap = 1, gy = gv): 1 * x is left out (exact), 16 cells per iteration. */
function fusedSpanLossless(p: usize, toVx: usize, toVy: usize, rowBytes: usize, i0: i32, i1: i32, gv: f32, gp: f32): void {
  const vGv = f32x4.splat(gv);
  const vGp = f32x4.splat(gp);
  const toBelow = 0 - rowBytes;
  const toVxBelow = toVx - rowBytes;
  const toVyBelow = toVy - rowBytes;
  let q = p + (<usize>i0 << 2);
  const end = p + (<usize>i1 << 2);
  // Four vectors per iteration, at constant offsets 0, 16, 32, 48 bytes (folded into the instructions),
  // measured a few per cent faster than two; each block is the single-vector body below.
  for (; q + 64 <= end; q += 64) {
    {
      const pj = v128.load(q);
      const pb = v128.load(q + toBelow);
      v128.store(q + toVx, f32x4.sub(v128.load(q + toVx), f32x4.mul(vGv, f32x4.sub(pj, v128.load(q - 4)))));
      const vy = f32x4.sub(v128.load(q + toVy), f32x4.mul(vGv, f32x4.sub(pj, pb)));
      v128.store(q + toVy, vy);
      const div = f32x4.add(f32x4.sub(v128.load(q + toVxBelow, 4), v128.load(q + toVxBelow)), f32x4.sub(vy, v128.load(q + toVyBelow)));
      v128.store(q + toBelow, f32x4.sub(pb, f32x4.mul(vGp, div)));
    }
    {
      const pj = v128.load(q, 16);
      const pb = v128.load(q + toBelow, 16);
      v128.store(q + toVx, f32x4.sub(v128.load(q + toVx, 16), f32x4.mul(vGv, f32x4.sub(pj, v128.load(q, 12)))), 16);
      const vy = f32x4.sub(v128.load(q + toVy, 16), f32x4.mul(vGv, f32x4.sub(pj, pb)));
      v128.store(q + toVy, vy, 16);
      const div = f32x4.add(f32x4.sub(v128.load(q + toVxBelow, 20), v128.load(q + toVxBelow, 16)), f32x4.sub(vy, v128.load(q + toVyBelow, 16)));
      v128.store(q + toBelow, f32x4.sub(pb, f32x4.mul(vGp, div)), 16);
    }
    {
      const pj = v128.load(q, 32);
      const pb = v128.load(q + toBelow, 32);
      v128.store(q + toVx, f32x4.sub(v128.load(q + toVx, 32), f32x4.mul(vGv, f32x4.sub(pj, v128.load(q, 28)))), 32);
      const vy = f32x4.sub(v128.load(q + toVy, 32), f32x4.mul(vGv, f32x4.sub(pj, pb)));
      v128.store(q + toVy, vy, 32);
      const div = f32x4.add(f32x4.sub(v128.load(q + toVxBelow, 36), v128.load(q + toVxBelow, 32)), f32x4.sub(vy, v128.load(q + toVyBelow, 32)));
      v128.store(q + toBelow, f32x4.sub(pb, f32x4.mul(vGp, div)), 32);
    }
    {
      const pj = v128.load(q, 48);
      const pb = v128.load(q + toBelow, 48);
      v128.store(q + toVx, f32x4.sub(v128.load(q + toVx, 48), f32x4.mul(vGv, f32x4.sub(pj, v128.load(q, 44)))), 48);
      const vy = f32x4.sub(v128.load(q + toVy, 48), f32x4.mul(vGv, f32x4.sub(pj, pb)));
      v128.store(q + toVy, vy, 48);
      const div = f32x4.add(f32x4.sub(v128.load(q + toVxBelow, 52), v128.load(q + toVxBelow, 48)), f32x4.sub(vy, v128.load(q + toVyBelow, 48)));
      v128.store(q + toBelow, f32x4.sub(pb, f32x4.mul(vGp, div)), 48);
    }
  }
  for (; q + 16 <= end; q += 16) {
    const pj = v128.load(q);
    const pb = v128.load(q + toBelow);
    v128.store(q + toVx, f32x4.sub(v128.load(q + toVx), f32x4.mul(vGv, f32x4.sub(pj, v128.load(q - 4)))));
    const vy = f32x4.sub(v128.load(q + toVy), f32x4.mul(vGv, f32x4.sub(pj, pb)));
    v128.store(q + toVy, vy);
    const div = f32x4.add(f32x4.sub(v128.load(q + toVxBelow, 4), v128.load(q + toVxBelow)), f32x4.sub(vy, v128.load(q + toVyBelow)));
    v128.store(q + toBelow, f32x4.sub(pb, f32x4.mul(vGp, div)));
  }
  for (; q < end; q += 4) {
    const pj = load<f32>(q);
    const pb = load<f32>(q + toBelow);
    store<f32>(q + toVx, load<f32>(q + toVx) - gv * (pj - load<f32>(q - 4)));
    const vy: f32 = load<f32>(q + toVy) - gv * (pj - pb);
    store<f32>(q + toVy, vy);
    const div: f32 = (load<f32>(q + toVxBelow, 4) - load<f32>(q + toVxBelow)) + (vy - load<f32>(q + toVyBelow));
    store<f32>(q + toBelow, pb - gp * div);
  }
}

/**
 * Interior span in general form (scalar coefficients): with attenuation (a = ap = decay), and where
 * velocity row j lies in the bottom or top PML (its y coefficients ay, gy) above an interior row j-1.
 */
function fusedSpanUniform(p: usize, toVx: usize, toVy: usize, rowBytes: usize, i0: i32, i1: i32, a: f32, gv: f32, ay: f32, gy: f32, gp: f32): void {
  const vA = f32x4.splat(a);
  const vGv = f32x4.splat(gv);
  const vAy = f32x4.splat(ay);
  const vGy = f32x4.splat(gy);
  const vGp = f32x4.splat(gp);
  const toBelow = 0 - rowBytes;
  const toVxBelow = toVx - rowBytes;
  const toVyBelow = toVy - rowBytes;
  let q = p + (<usize>i0 << 2);
  const end = p + (<usize>i1 << 2);
  for (; q + 16 <= end; q += 16) {
    const pj = v128.load(q);
    const pb = v128.load(q + toBelow);
    const vx = f32x4.sub(f32x4.mul(vA, v128.load(q + toVx)), f32x4.mul(vGv, f32x4.sub(pj, v128.load(q - 4))));
    v128.store(q + toVx, vx);
    const vy = f32x4.sub(f32x4.mul(vAy, v128.load(q + toVy)), f32x4.mul(vGy, f32x4.sub(pj, pb)));
    v128.store(q + toVy, vy);
    const div = f32x4.add(f32x4.sub(v128.load(q + toVxBelow, 4), v128.load(q + toVxBelow)), f32x4.sub(vy, v128.load(q + toVyBelow)));
    v128.store(q + toBelow, f32x4.sub(f32x4.mul(vA, pb), f32x4.mul(vGp, div)));
  }
  for (; q < end; q += 4) {
    const pj = load<f32>(q);
    const pb = load<f32>(q + toBelow);
    store<f32>(q + toVx, a * load<f32>(q + toVx) - gv * (pj - load<f32>(q - 4)));
    const vy: f32 = ay * load<f32>(q + toVy) - gy * (pj - pb);
    store<f32>(q + toVy, vy);
    const div: f32 = (load<f32>(q + toVxBelow, 4) - load<f32>(q + toVxBelow)) + (vy - load<f32>(q + toVyBelow));
    store<f32>(q + toBelow, a * pb - gp * div);
  }
}

/**
 * Span whose pressure row j-1 lies in the bottom or top PML, between the side PMLs: the split update
 *   px = a px - gp (vx[j-1][i+1] - vx[j-1][i]),  py = ayp (p - px) - byp (vy[j][i] - vy[j-1][i]),  p = px + py
 * (x part with the uniform a, gp; y part with row j-1's ayp, byp), after vx (a, gv) and vy (ay, gy).
 */
function fusedSpanSplit(p: usize, toVx: usize, toVy: usize, toPx: usize, rowBytes: usize, i0: i32, i1: i32, a: f32, gv: f32, ay: f32, gy: f32, gp: f32, ayp: f32, byp: f32): void {
  const vA = f32x4.splat(a);
  const vGv = f32x4.splat(gv);
  const vAy = f32x4.splat(ay);
  const vGy = f32x4.splat(gy);
  const vGp = f32x4.splat(gp);
  const vAyp = f32x4.splat(ayp);
  const vByp = f32x4.splat(byp);
  const toBelow = 0 - rowBytes;
  const toVxBelow = toVx - rowBytes;
  const toVyBelow = toVy - rowBytes;
  let q = p + (<usize>i0 << 2);
  const end = p + (<usize>i1 << 2);
  for (; q + 16 <= end; q += 16) {
    const pj = v128.load(q);
    const pb = v128.load(q + toBelow);
    const vx = f32x4.sub(f32x4.mul(vA, v128.load(q + toVx)), f32x4.mul(vGv, f32x4.sub(pj, v128.load(q - 4))));
    v128.store(q + toVx, vx);
    const vy = f32x4.sub(f32x4.mul(vAy, v128.load(q + toVy)), f32x4.mul(vGy, f32x4.sub(pj, pb)));
    v128.store(q + toVy, vy);
    const oldX = v128.load(q + toPx);
    const oldY = f32x4.sub(pb, oldX);
    const newX = f32x4.sub(f32x4.mul(vA, oldX), f32x4.mul(vGp, f32x4.sub(v128.load(q + toVxBelow, 4), v128.load(q + toVxBelow))));
    const newY = f32x4.sub(f32x4.mul(vAyp, oldY), f32x4.mul(vByp, f32x4.sub(vy, v128.load(q + toVyBelow))));
    v128.store(q + toPx, newX);
    v128.store(q + toBelow, f32x4.add(newX, newY));
  }
  for (; q < end; q += 4) {
    const pj = load<f32>(q);
    const pb = load<f32>(q + toBelow);
    store<f32>(q + toVx, a * load<f32>(q + toVx) - gv * (pj - load<f32>(q - 4)));
    const vy: f32 = ay * load<f32>(q + toVy) - gy * (pj - pb);
    store<f32>(q + toVy, vy);
    const oldX = load<f32>(q + toPx);
    const oldY: f32 = pb - oldX;
    const newX: f32 = a * oldX - gp * (load<f32>(q + toVxBelow, 4) - load<f32>(q + toVxBelow));
    const newY: f32 = ayp * oldY - byp * (vy - load<f32>(q + toVyBelow));
    store<f32>(q + toPx, newX);
    store<f32>(q + toBelow, newX + newY);
  }
}

/**
 * Span over the columns of a side PML: vx with the column tables of face decay and gain (faceDecays,
 * faceGains), vy with (ay, gy), and the split pressure of row j-1 with the column tables of cell decay
 * and gain (cellDecays, cellGains) for the x part and (ayp, byp) for the y part. Tables are byte
 * addresses of their element 0.
 */
function fusedSpanSide(
  p: usize, toVx: usize, toVy: usize, toPx: usize, rowBytes: usize, i0: i32, i1: i32,
  faceDecays: usize, faceGains: usize, cellDecays: usize, cellGains: usize, ay: f32, gy: f32, ayp: f32, byp: f32,
): void {
  const vAy = f32x4.splat(ay);
  const vGy = f32x4.splat(gy);
  const vAyp = f32x4.splat(ayp);
  const vByp = f32x4.splat(byp);
  const toBelow = 0 - rowBytes;
  const toVxBelow = toVx - rowBytes;
  const toVyBelow = toVy - rowBytes;
  const toFaceDecay = faceDecays - p;
  const toFaceGain = faceGains - p;
  const toCellDecay = cellDecays - p;
  const toCellGain = cellGains - p;
  let q = p + (<usize>i0 << 2);
  const end = p + (<usize>i1 << 2);
  for (; q + 16 <= end; q += 16) {
    const pj = v128.load(q);
    const pb = v128.load(q + toBelow);
    const vx = f32x4.sub(f32x4.mul(v128.load(q + toFaceDecay), v128.load(q + toVx)), f32x4.mul(v128.load(q + toFaceGain), f32x4.sub(pj, v128.load(q - 4))));
    v128.store(q + toVx, vx);
    const vy = f32x4.sub(f32x4.mul(vAy, v128.load(q + toVy)), f32x4.mul(vGy, f32x4.sub(pj, pb)));
    v128.store(q + toVy, vy);
    const oldX = v128.load(q + toPx);
    const oldY = f32x4.sub(pb, oldX);
    const newX = f32x4.sub(f32x4.mul(v128.load(q + toCellDecay), oldX), f32x4.mul(v128.load(q + toCellGain), f32x4.sub(v128.load(q + toVxBelow, 4), v128.load(q + toVxBelow))));
    const newY = f32x4.sub(f32x4.mul(vAyp, oldY), f32x4.mul(vByp, f32x4.sub(vy, v128.load(q + toVyBelow))));
    v128.store(q + toPx, newX);
    v128.store(q + toBelow, f32x4.add(newX, newY));
  }
  for (; q < end; q += 4) {
    const pj = load<f32>(q);
    const pb = load<f32>(q + toBelow);
    store<f32>(q + toVx, load<f32>(q + toFaceDecay) * load<f32>(q + toVx) - load<f32>(q + toFaceGain) * (pj - load<f32>(q - 4)));
    const vy: f32 = ay * load<f32>(q + toVy) - gy * (pj - pb);
    store<f32>(q + toVy, vy);
    const oldX = load<f32>(q + toPx);
    const oldY: f32 = pb - oldX;
    const newX: f32 = load<f32>(q + toCellDecay) * oldX - load<f32>(q + toCellGain) * (load<f32>(q + toVxBelow, 4) - load<f32>(q + toVxBelow));
    const newY: f32 = ayp * oldY - byp * (vy - load<f32>(q + toVyBelow));
    store<f32>(q + toPx, newX);
    store<f32>(q + toBelow, newX + newY);
  }
}

/** Running peak |p| (float32) and sum of p^2 (float64; `sum` is a byte address) over `count` cells of a row. */
function accumulateLevels(p: usize, peak: usize, sum: usize, count: i32): void {
  let i = 0;
  for (; i + 4 <= count; i += 4) {
    const v = v128.load(p + (<usize>i << 2));
    const k = peak + (<usize>i << 2);
    v128.store(k, f32x4.max(v128.load(k), f32x4.abs(v)));
    const lo = f64x2.promote_low_f32x4(v);
    const hi = f64x2.promote_low_f32x4(v128.shuffle<f32>(v, v, 2, 3, 2, 3));
    const s = sum + (<usize>i << 3);
    v128.store(s, f64x2.add(v128.load(s), f64x2.mul(lo, lo)));
    v128.store(s, f64x2.add(v128.load(s, 16), f64x2.mul(hi, hi)), 16);
  }
  for (; i < count; i++) {
    const value = load<f32>(p + (<usize>i << 2));
    const magnitude = Mathf.abs(value);
    const k = peak + (<usize>i << 2);
    if (magnitude > load<f32>(k)) store<f32>(k, magnitude);
    const s = sum + (<usize>i << 3);
    const wide = <f64>value;
    store<f64>(s, load<f64>(s) + wide * wide);
  }
}

// ---------------------------------------------------------------------------------------------
// Sweep (the same row updates as lib/fdtd/kernel.ts)

function velocityRow(j: i32): void {
  const vx = at(velocityXBase + j * stride);
  const p = at(pressureBase + j * stride);
  const pmlRow = isPmlRow(j);
  // x-faces 1 .. pmlLeft-1 and nx-pmlRight+1 .. nx-1 lie inside a side PML; the interface faces and the
  // columns between have no x damping (in a bottom or top PML row too: their medium is the background).
  const iL = pmlLeft > 1 ? pmlLeft : 1;
  const iR = pmlRight > 0 ? nx - pmlRight + 1 : nx;
  if (iL > 1) velocityXTable(vx, p, at(pmlColumns + 2 * stride), at(pmlColumns + 3 * stride), 1, iL);
  if (heterogeneous && !pmlRow) velocityXField(vx, p, at(faceGainXBase + j * stride), iL, iR, decay);
  else velocityXUniform(vx, p, iL, iR, decay, velocityGain);
  if (iR < nx) velocityXTable(vx, p, at(pmlColumns + 2 * stride), at(pmlColumns + 3 * stride), iR, nx);
  if (j >= 1) {
    const vy = at(velocityYBase + j * stride);
    const pBelow = p - at(stride);
    if (pmlRow) velocityYUniform(vy, p, pBelow, 0, nx, load<f32>(at(pmlRows + 2 * (ny + 1) + j)), load<f32>(at(pmlRows + 3 * (ny + 1) + j)));
    else if (heterogeneous) velocityYField(vy, p, pBelow, at(faceGainYBase + j * stride), 0, nx, decay);
    else velocityYUniform(vy, p, pBelow, 0, nx, decay, velocityGain);
  }
}

/** Boundary faces of sweep row j: v = decay * state + gain * p[fluid cell]; rigid faces have decay = gain = 0. */
function boundaryFaces(j: i32): void {
  const target = slot(P_SPECIAL_TARGET);
  const fluid = slot(P_SPECIAL_FLUID_CELL);
  const decays = slot(P_SPECIAL_DECAY);
  const gains = slot(P_SPECIAL_GAIN);
  const state = slot(P_SPECIAL_STATE);
  const start = load<i32>(at(specialRowStart + j));
  const end = load<i32>(at(specialRowStart + j + 1));
  for (let s = start; s < end; s++) {
    const v: f32 = load<f32>(at(decays + s)) * load<f32>(at(state + s)) + load<f32>(at(gains + s)) * load<f32>(at(load<i32>(at(fluid + s))));
    store<f32>(at(state + s), v);
    store<f32>(at(load<i32>(at(target + s))), v);
  }
}

/** Solid cells of row j behind an impedance face are held at zero, in p and (inside a PML) in px. */
function holdZeroCells(j: i32): void {
  const zeroCell = slot(P_ZERO_CELL);
  const start = load<i32>(at(zeroRowStart + j));
  const end = load<i32>(at(zeroRowStart + j + 1));
  if (start == end) return;
  const pmlRow = isPmlRow(j);
  const px = hasPml ? pmlRowOffset(j) : 0;
  for (let s = start; s < end; s++) {
    const cell = load<i32>(at(zeroCell + s));
    store<f32>(at(pressureBase + cell), 0);
    if (!hasPml) continue;
    const i = cell - j * stride;
    if (pmlRow || i < pmlLeft) store<f32>(at(px + i), 0);
    else if (i >= nx - pmlRight) store<f32>(at(px + sideLeft + i - (nx - pmlRight)), 0);
  }
}

function pressureRow(j: i32): void {
  const p = at(pressureBase + j * stride);
  const vx = at(velocityXBase + j * stride);
  const vy = at(velocityYBase + j * stride);
  const vyAbove = vy + at(stride);
  if (levelMaps) accumulateLevels(p, at(peakBase + j * stride), <usize>(squareSumBase + j * stride) << 3, nx);
  const iL = pmlLeft;
  const iR = nx - pmlRight;
  const ax = at(pmlColumns);
  const bx = at(pmlColumns + stride);
  if (isPmlRow(j)) {
    const px = at(pmlRowOffset(j));
    const ay = load<f32>(at(pmlRows + j));
    const by = load<f32>(at(pmlRows + (ny + 1) + j));
    if (iL > 0) pressureSplit(p, px, vx, vy, vyAbove, ax, bx, 0, iL, ay, by);
    pressureSplitUniformX(p, px, vx, vy, vyAbove, iL, iR, decay, pressureGain, ay, by);
    if (iR < nx) pressureSplit(p, px, vx, vy, vyAbove, ax, bx, iR, nx, ay, by);
  } else {
    const px = hasPml ? at(pmlRowOffset(j)) : 0;
    if (iL > 0) pressureSplit(p, px, vx, vy, vyAbove, ax, bx, 0, iL, decay, pressureGain);
    if (heterogeneous) pressureField(p, vx, vy, vyAbove, at(cellGainBase + j * stride), iL, iR, decay);
    else pressureUniform(p, vx, vy, vyAbove, iL, iR, decay, pressureGain);
    // Packed side row: the right columns start at px + sideLeft.
    if (iR < nx) pressureSplit(p, px + at(sideLeft) - at(iR), vx, vy, vyAbove, ax, bx, iR, nx, decay, pressureGain);
  }
  holdZeroCells(j);
}

/**
 * Whether velocity row j and pressure row j-1 can be updated in one pass: one uniform medium and no
 * boundary face in row j (its update reads old pressures of row j-1, which the pass overwrites).
 */
function fusable(j: i32): bool {
  if (heterogeneous || j < 1) return false;
  return load<i32>(at(specialRowStart + j)) == load<i32>(at(specialRowStart + j + 1));
}

/**
 * Velocity row j and pressure row j-1 (as velocityRow(j), boundaryFaces(j) with none, pressureRow(j-1))
 * in three fused spans: left PML columns [0, pmlLeft), the columns between, right PML columns
 * [nx - pmlRight, nx), cells and x-faces alike. The right span thus updates the interface face
 * nx - pmlRight from the column tables where the reference uses the uniform coefficients: the tables
 * hold exactly those there (tests/fdtd/kernel.test.ts checks it), so the numbers are the same.
 */
function fusedRow(j: i32): void {
  const rowBytes = at(stride);
  const p = at(pressureBase + j * stride);
  const vx = at(velocityXBase + j * stride);
  const toVx = vx - p;
  const toVy = at(velocityYBase + j * stride) - p;
  // The level maps record the pressure at time n, before this pass changes row j-1.
  if (levelMaps) accumulateLevels(p - rowBytes, at(peakBase + (j - 1) * stride), <usize>(squareSumBase + (j - 1) * stride) << 3, nx);
  // The outer face vx[j][0] is never updated (rigid, or zero behind a PML); the first span overwrites it.
  const outerFace = load<f32>(vx);
  // y-velocity coefficients of row j: its own in a bottom or top PML row.
  const pmlVelocityRow = isPmlRow(j);
  const ay = pmlVelocityRow ? load<f32>(at(pmlRows + 2 * (ny + 1) + j)) : decay;
  const gy = pmlVelocityRow ? load<f32>(at(pmlRows + 3 * (ny + 1) + j)) : velocityGain;
  const pmlPressureRow = isPmlRow(j - 1);
  const ayp = pmlPressureRow ? load<f32>(at(pmlRows + j - 1)) : decay;
  const byp = pmlPressureRow ? load<f32>(at(pmlRows + (ny + 1) + j - 1)) : pressureGain;
  const cL = pmlLeft;
  const cR = nx - pmlRight;
  if (hasPml) {
    // px[j-1][i]: at row + i in a PML row and in the left part of a packed side row.
    const toPxLeft = at(pmlRowOffset(j - 1)) - p;
    const toPxRight = pmlPressureRow ? toPxLeft : toPxLeft + at(sideLeft) - at(cR);
    const cellDecays = at(pmlColumns);
    const cellGains = at(pmlColumns + stride);
    const faceDecays = at(pmlColumns + 2 * stride);
    const faceGains = at(pmlColumns + 3 * stride);
    if (cL > 0) fusedSpanSide(p, toVx, toVy, toPxLeft, rowBytes, 0, cL, faceDecays, faceGains, cellDecays, cellGains, ay, gy, ayp, byp);
    if (pmlPressureRow) fusedSpanSplit(p, toVx, toVy, toPxLeft, rowBytes, cL, cR, decay, velocityGain, ay, gy, pressureGain, ayp, byp);
    else if (decay == 1.0 && !pmlVelocityRow) fusedSpanLossless(p, toVx, toVy, rowBytes, cL, cR, velocityGain, pressureGain);
    else fusedSpanUniform(p, toVx, toVy, rowBytes, cL, cR, decay, velocityGain, ay, gy, pressureGain);
    if (cR < nx) fusedSpanSide(p, toVx, toVy, toPxRight, rowBytes, cR, nx, faceDecays, faceGains, cellDecays, cellGains, ay, gy, ayp, byp);
  } else if (decay == 1.0) {
    fusedSpanLossless(p, toVx, toVy, rowBytes, 0, nx, velocityGain, pressureGain);
  } else {
    fusedSpanUniform(p, toVx, toVy, rowBytes, 0, nx, decay, velocityGain, decay, velocityGain, pressureGain);
  }
  store<f32>(vx, outerFace);
  holdZeroCells(j - 1);
}

/** Phase 1 of a step for rows [y0, y1): velocity rows with their boundary faces, pressure rows [y0, y1 - 1). */
export function sweepStrip(y0: i32, y1: i32): void {
  readParams();
  for (let j = y0; j < y1; j++) {
    if (j > y0 && fusable(j)) {
      fusedRow(j);
    } else {
      velocityRow(j);
      boundaryFaces(j);
      if (j > y0) pressureRow(j - 1);
    }
  }
}

/** Phase 2: pressure row y1 - 1, once the strip above has swept. */
export function finishStrip(y0: i32, y1: i32): void {
  readParams();
  if (y1 > y0) pressureRow(y1 - 1);
}

/** x = (x + F) - F over `count` floats from byte address `start`: tiny values to zero, the rest to the quantum. */
function flushRow(start: usize, count: i32, flush: f32): void {
  const vF = f32x4.splat(flush);
  let q = start;
  const end = start + (<usize>count << 2);
  for (; q + 16 <= end; q += 16) v128.store(q, f32x4.sub(f32x4.add(v128.load(q), vF), vF));
  for (; q < end; q += 4) store<f32>(q, (load<f32>(q) + flush) - flush);
}

/** Flushes rows [y0, y1) of every field, and the top y-velocity row with the last strip (after phase 2). */
export function flushStrip(y0: i32, y1: i32): void {
  readParams();
  const flushP = slotF(P_FLUSH_PRESSURE);
  const flushV = slotF(P_FLUSH_VELOCITY);
  for (let j = y0; j < y1; j++) {
    flushRow(at(pressureBase + j * stride), nx, flushP);
    if (hasPml) flushRow(at(pmlRowOffset(j)), isPmlRow(j) ? nx : sideWidth, flushP);
    flushRow(at(velocityXBase + j * stride), nx + 1, flushV);
    flushRow(at(velocityYBase + j * stride), nx, flushV);
  }
  if (y1 == ny && y1 > y0) flushRow(at(velocityYBase + ny * stride), nx, flushV);
}
