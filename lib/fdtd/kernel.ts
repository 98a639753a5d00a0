// The reference time-stepping kernel in TypeScript. It emulates float32 arithmetic exactly (Math.fround
// after every operation) so that the WebAssembly SIMD kernel, which computes in float32, gives
// bit-identical fields; the two read the same state layout and parameter block.
//
// Fields (see layout.ts; rows are j, the x index i runs fastest):
//   pressure p[j][i]     at the cell centre, time n dt                      i < nx, j < ny
//   velocityX vx[j][i]   on the x-face between cells i-1 and i, (n+1/2) dt  i <= nx, j < ny
//   velocityY vy[j][i]   on the y-face between rows j-1 and j, (n+1/2) dt   i < nx, j <= ny
// One step, with a = decay, gv = velocity gain dt/(rho h), gp = pressure gain rho c^2 dt / h:
//   vx[j][i] = a vx[j][i] - gv (p[j][i] - p[j][i-1])                        1 <= i <= nx-1
//   vy[j][i] = a vy[j][i] - gv (p[j][i] - p[j-1][i])                        1 <= j <= ny-1
//   p[j][i]  = a p[j][i]  - gp (vx[j][i+1] - vx[j][i] + vy[j+1][i] - vy[j][i])
// Outer faces (i = 0, nx; j = 0, ny) are never updated by the sweep: zero (rigid) unless a boundary face
// entry writes them. Inside a PML the pressure is split, p = px + py, each part damped along its own axis:
//   px = ax[i] px - bx[i] (vx[j][i+1] - vx[j][i]);  py = ay[j] py - by[j] (vy[j+1][i] - vy[j][i])
// and each velocity component is damped along its own axis (tables per column and per row).
// The x part px is stored only inside the PML, packed by rows (layout.ts, pmlPressureXRow). In the bottom
// and top PML rows the columns between the side PMLs have no x damping: there ax, bx are the uniform
// decay and gain (the column tables hold the same numbers), which saves two table loads per cell.
// The WebAssembly kernel fuses a velocity row with the pressure row below it where no boundary face
// intervenes; every value is computed from the same inputs by the same float32 operations as here, so
// the order of the loops does not change a bit of the result.
// Float32 subnormals (below 1.2e-38) appear ahead of the wavefront and in decaying regions and are slow
// on x86; WebAssembly cannot switch on flush-to-zero. So every FLUSH_INTERVAL steps `flushStrip` passes
// each stored value through (x + F) - F in float32, which rounds it to a multiple of the quantum
// (the float32 spacing at F) and zeroes anything smaller. Between two flushes a value at the quantum
// cannot decay by the 1e-15 or more it would need to become subnormal (see state.ts for F).
import {
  FLAG_HETEROGENEOUS,
  FLAG_LEVEL_MAPS,
  FLAG_PML,
  P_CELL_GAIN,
  P_DECAY,
  P_FACE_GAIN_X,
  P_FACE_GAIN_Y,
  P_FLAGS,
  P_FLUSH_PRESSURE,
  P_FLUSH_VELOCITY,
  P_NX,
  P_NY,
  P_PEAK_PRESSURE,
  P_PML_BOTTOM,
  P_PML_COLUMNS,
  P_PML_LEFT,
  P_PML_PRESSURE_X,
  P_PML_RIGHT,
  P_PML_ROWS,
  P_PML_TOP,
  P_PRESSURE,
  P_PRESSURE_GAIN,
  P_PRESSURE_SQUARE_SUM,
  P_SPECIAL_DECAY,
  P_SPECIAL_FLUID_CELL,
  P_SPECIAL_GAIN,
  P_SPECIAL_ROW_START,
  P_SPECIAL_STATE,
  P_SPECIAL_TARGET,
  P_STRIDE,
  P_VELOCITY_GAIN,
  P_VELOCITY_X,
  P_VELOCITY_Y,
  P_ZERO_CELL,
  P_ZERO_ROW_START,
  PARAM_SLOTS,
  PARAMS_BYTE_OFFSET,
} from "./kernel-params";
import { pmlPressureXRow, pmlSideLeftWidth, pmlSideRowWidth, type PmlCells } from "./layout";

/**
 * Steps one simulation's fields by horizontal strips of rows. A full step is: `sweepStrip` for every
 * strip (in any order or in parallel), then `finishStrip` for every strip, then the sources. Strips
 * share the buffer: a strip's halo is the pressure row just below it (read at time n during the sweep)
 * and the y-velocity row just above it (written by the next strip's sweep, read by `finishStrip`).
 */
export interface StepKernel {
  readonly name: string;
  /** Velocity rows [y0, y1) with their boundary faces, and pressure rows [y0, y1 - 1). */
  sweepStrip(y0: number, y1: number): void;
  /** Pressure row y1 - 1, once the strip above has swept. */
  finishStrip(y0: number, y1: number): void;
  /** Flushes tiny values of rows [y0, y1) of every field (and y-velocity row ny with the top strip). */
  flushStrip(y0: number, y1: number): void;
}

/** Steps between two flushes of tiny values. */
export const FLUSH_INTERVAL = 16;

const fr = Math.fround;

interface Context {
  f: Float32Array;
  d: Float64Array;
  n: Int32Array;
  nx: number;
  ny: number;
  stride: number;
  pmlLeft: number;
  pmlRight: number;
  pmlBottom: number;
  pmlTop: number;
  pressure: number;
  velocityX: number;
  velocityY: number;
  pmlPressureX: number;
  pmlCells: PmlCells;
  /** Offset of the right PML columns in a packed side row of px, and the floats of such a row. */
  pmlSideLeft: number;
  pmlSideWidth: number;
  /** Column tables: cell decay, cell gain, x-face decay, x-face gain. */
  colCellDecay: number;
  colCellGain: number;
  colFaceDecay: number;
  colFaceGain: number;
  /** Row tables: cell decay, cell gain, y-face decay, y-face gain. */
  rowCellDecay: number;
  rowCellGain: number;
  rowFaceDecay: number;
  rowFaceGain: number;
  cellGain: number;
  faceGainX: number;
  faceGainY: number;
  peak: number;
  squareSum: number;
  specialRowStart: number;
  specialTarget: number;
  specialFluidCell: number;
  specialDecay: number;
  specialGain: number;
  specialState: number;
  zeroRowStart: number;
  zeroCell: number;
  heterogeneous: boolean;
  levelMaps: boolean;
  hasPml: boolean;
  decay: number;
  velocityGain: number;
  pressureGain: number;
  flushPressure: number;
  flushVelocity: number;
}

function readContext(buffer: ArrayBufferLike): Context {
  const i32 = new Int32Array(buffer, PARAMS_BYTE_OFFSET, PARAM_SLOTS);
  const f32 = new Float32Array(buffer, PARAMS_BYTE_OFFSET, PARAM_SLOTS);
  const at = (slot: number) => i32[slot]!;
  const flags = at(P_FLAGS);
  const stride = at(P_STRIDE);
  const ny = at(P_NY);
  const cols = at(P_PML_COLUMNS);
  const rows = at(P_PML_ROWS);
  const pmlCells = { left: at(P_PML_LEFT), right: at(P_PML_RIGHT), bottom: at(P_PML_BOTTOM), top: at(P_PML_TOP) };
  return {
    f: new Float32Array(buffer),
    d: new Float64Array(buffer, 0, Math.floor(buffer.byteLength / 8)),
    n: new Int32Array(buffer),
    nx: at(P_NX),
    ny,
    stride,
    pmlLeft: at(P_PML_LEFT),
    pmlRight: at(P_PML_RIGHT),
    pmlBottom: at(P_PML_BOTTOM),
    pmlTop: at(P_PML_TOP),
    pressure: at(P_PRESSURE),
    velocityX: at(P_VELOCITY_X),
    velocityY: at(P_VELOCITY_Y),
    pmlPressureX: at(P_PML_PRESSURE_X),
    pmlCells,
    pmlSideLeft: pmlSideLeftWidth(pmlCells),
    pmlSideWidth: pmlSideRowWidth(pmlCells),
    colCellDecay: cols,
    colCellGain: cols + stride,
    colFaceDecay: cols + 2 * stride,
    colFaceGain: cols + 3 * stride,
    rowCellDecay: rows,
    rowCellGain: rows + (ny + 1),
    rowFaceDecay: rows + 2 * (ny + 1),
    rowFaceGain: rows + 3 * (ny + 1),
    cellGain: at(P_CELL_GAIN),
    faceGainX: at(P_FACE_GAIN_X),
    faceGainY: at(P_FACE_GAIN_Y),
    peak: at(P_PEAK_PRESSURE),
    squareSum: at(P_PRESSURE_SQUARE_SUM),
    specialRowStart: at(P_SPECIAL_ROW_START),
    specialTarget: at(P_SPECIAL_TARGET),
    specialFluidCell: at(P_SPECIAL_FLUID_CELL),
    specialDecay: at(P_SPECIAL_DECAY),
    specialGain: at(P_SPECIAL_GAIN),
    specialState: at(P_SPECIAL_STATE),
    zeroRowStart: at(P_ZERO_ROW_START),
    zeroCell: at(P_ZERO_CELL),
    heterogeneous: (flags & FLAG_HETEROGENEOUS) !== 0,
    levelMaps: (flags & FLAG_LEVEL_MAPS) !== 0,
    hasPml: (flags & FLAG_PML) !== 0,
    decay: f32[P_DECAY]!,
    velocityGain: f32[P_VELOCITY_GAIN]!,
    pressureGain: f32[P_PRESSURE_GAIN]!,
    flushPressure: f32[P_FLUSH_PRESSURE]!,
    flushVelocity: f32[P_FLUSH_VELOCITY]!,
  };
}

// ---------------------------------------------------------------------------------------------
// Row kernels. Arguments are element offsets into `f` (the whole buffer as float32): `vx`, `vy`, `p`,
// `px` are the starts of one row; i runs over [i0, i1). Gains and decays are float32 values.

/** vx[i] = decay vx[i] - gain (p[i] - p[i-1]) with scalar decay and gain (uniform medium). */
export function velocityXUniform(f: Float32Array, vx: number, p: number, i0: number, i1: number, decay: number, gain: number): void {
  if (decay === 1) {
    for (let i = i0; i < i1; i++) f[vx + i] = fr(f[vx + i]! - fr(gain * fr(f[p + i]! - f[p + i - 1]!)));
  } else {
    for (let i = i0; i < i1; i++) f[vx + i] = fr(fr(decay * f[vx + i]!) - fr(gain * fr(f[p + i]! - f[p + i - 1]!)));
  }
}

/** As velocityXUniform with the gain per face from a row of a gain field starting at `g` (medium regions). */
export function velocityXField(f: Float32Array, vx: number, p: number, g: number, i0: number, i1: number, decay: number): void {
  for (let i = i0; i < i1; i++) f[vx + i] = fr(fr(decay * f[vx + i]!) - fr(f[g + i]! * fr(f[p + i]! - f[p + i - 1]!)));
}

/** As velocityXUniform with decay and gain per column from tables starting at `decays`, `gains` (PML). */
export function velocityXTable(f: Float32Array, vx: number, p: number, decays: number, gains: number, i0: number, i1: number): void {
  for (let i = i0; i < i1; i++) f[vx + i] = fr(fr(f[decays + i]! * f[vx + i]!) - fr(f[gains + i]! * fr(f[p + i]! - f[p + i - 1]!)));
}

/** vy[i] = decay vy[i] - gain (p[i] - pBelow[i]) with scalar decay and gain. */
export function velocityYUniform(f: Float32Array, vy: number, p: number, pBelow: number, i0: number, i1: number, decay: number, gain: number): void {
  if (decay === 1) {
    for (let i = i0; i < i1; i++) f[vy + i] = fr(f[vy + i]! - fr(gain * fr(f[p + i]! - f[pBelow + i]!)));
  } else {
    for (let i = i0; i < i1; i++) f[vy + i] = fr(fr(decay * f[vy + i]!) - fr(gain * fr(f[p + i]! - f[pBelow + i]!)));
  }
}

/** As velocityYUniform with the gain per face from a gain-field row at `g`. */
export function velocityYField(f: Float32Array, vy: number, p: number, pBelow: number, g: number, i0: number, i1: number, decay: number): void {
  for (let i = i0; i < i1; i++) f[vy + i] = fr(fr(decay * f[vy + i]!) - fr(f[g + i]! * fr(f[p + i]! - f[pBelow + i]!)));
}

/** p[i] = decay p[i] - gain (vx[i+1] - vx[i] + vyAbove[i] - vy[i]) with scalar decay and gain. */
export function pressureUniform(f: Float32Array, p: number, vx: number, vy: number, vyAbove: number, i0: number, i1: number, decay: number, gain: number): void {
  if (decay === 1) {
    for (let i = i0; i < i1; i++) {
      const divergence = fr(fr(f[vx + i + 1]! - f[vx + i]!) + fr(f[vyAbove + i]! - f[vy + i]!));
      f[p + i] = fr(f[p + i]! - fr(gain * divergence));
    }
  } else {
    for (let i = i0; i < i1; i++) {
      const divergence = fr(fr(f[vx + i + 1]! - f[vx + i]!) + fr(f[vyAbove + i]! - f[vy + i]!));
      f[p + i] = fr(fr(decay * f[p + i]!) - fr(gain * divergence));
    }
  }
}

/** As pressureUniform with the gain per cell from a gain-field row at `g`. */
export function pressureField(f: Float32Array, p: number, vx: number, vy: number, vyAbove: number, g: number, i0: number, i1: number, decay: number): void {
  for (let i = i0; i < i1; i++) {
    const divergence = fr(fr(f[vx + i + 1]! - f[vx + i]!) + fr(f[vyAbove + i]! - f[vy + i]!));
    f[p + i] = fr(fr(decay * f[p + i]!) - fr(f[g + i]! * divergence));
  }
}

/**
 * Split-field PML cells: px = ax[i] px - bx[i] dvx, py = ay py - by dvy with py = p - px, then p = px + py.
 * `px` is the row of the stored x part; ax, bx are column tables, ay, by this row's scalars.
 */
export function pressureSplit(
  f: Float32Array,
  p: number,
  px: number,
  vx: number,
  vy: number,
  vyAbove: number,
  ax: number,
  bx: number,
  i0: number,
  i1: number,
  ay: number,
  by: number,
): void {
  for (let i = i0; i < i1; i++) {
    const oldX = f[px + i]!;
    const oldY = fr(f[p + i]! - oldX);
    const newX = fr(fr(f[ax + i]! * oldX) - fr(f[bx + i]! * fr(f[vx + i + 1]! - f[vx + i]!)));
    const newY = fr(fr(ay * oldY) - fr(by * fr(f[vyAbove + i]! - f[vy + i]!)));
    f[px + i] = newX;
    f[p + i] = fr(newX + newY);
  }
}

/** As pressureSplit with scalar x coefficients ax, bx (bottom and top PML rows, between the side PMLs). */
export function pressureSplitUniformX(
  f: Float32Array,
  p: number,
  px: number,
  vx: number,
  vy: number,
  vyAbove: number,
  i0: number,
  i1: number,
  ax: number,
  bx: number,
  ay: number,
  by: number,
): void {
  for (let i = i0; i < i1; i++) {
    const oldX = f[px + i]!;
    const oldY = fr(f[p + i]! - oldX);
    const newX = fr(fr(ax * oldX) - fr(bx * fr(f[vx + i + 1]! - f[vx + i]!)));
    const newY = fr(fr(ay * oldY) - fr(by * fr(f[vyAbove + i]! - f[vy + i]!)));
    f[px + i] = newX;
    f[p + i] = fr(newX + newY);
  }
}

/** Running peak |p| (float32) and sum of p^2 (float64, `sum` is a Float64 offset) over one row. */
export function accumulateLevels(f: Float32Array, d: Float64Array, p: number, peak: number, sum: number, count: number): void {
  for (let i = 0; i < count; i++) {
    const value = f[p + i]!;
    const magnitude = Math.abs(value);
    if (magnitude > f[peak + i]!) f[peak + i] = magnitude;
    d[sum + i] = d[sum + i]! + value * value;
  }
}

// ---------------------------------------------------------------------------------------------
// Sweep

function velocityRow(k: Context, j: number): void {
  const { f, nx, stride } = k;
  const vx = k.velocityX + j * stride;
  const p = k.pressure + j * stride;
  const pmlRow = j < k.pmlBottom || j >= k.ny - k.pmlTop;
  // x-faces 1 .. pmlLeft-1 and nx-pmlRight+1 .. nx-1 lie inside a side PML; the interface faces and the
  // columns between have no x damping (in a bottom or top PML row too: their medium is the background).
  const iL = Math.max(1, k.pmlLeft);
  const iR = k.pmlRight > 0 ? nx - k.pmlRight + 1 : nx;
  if (iL > 1) velocityXTable(f, vx, p, k.colFaceDecay, k.colFaceGain, 1, iL);
  if (k.heterogeneous && !pmlRow) velocityXField(f, vx, p, k.faceGainX + j * stride, iL, iR, k.decay);
  else velocityXUniform(f, vx, p, iL, iR, k.decay, k.velocityGain);
  if (iR < nx) velocityXTable(f, vx, p, k.colFaceDecay, k.colFaceGain, iR, nx);
  if (j >= 1) {
    const vy = k.velocityY + j * stride;
    if (pmlRow) velocityYUniform(f, vy, p, p - stride, 0, nx, f[k.rowFaceDecay + j]!, f[k.rowFaceGain + j]!);
    else if (k.heterogeneous) velocityYField(f, vy, p, p - stride, k.faceGainY + j * stride, 0, nx, k.decay);
    else velocityYUniform(f, vy, p, p - stride, 0, nx, k.decay, k.velocityGain);
  }
}

/** Boundary faces of sweep row j: v = decay * state + gain * p[fluid cell]; rigid faces have decay = gain = 0. */
function boundaryFaces(k: Context, j: number): void {
  const { f, n } = k;
  const start = n[k.specialRowStart + j]!;
  const end = n[k.specialRowStart + j + 1]!;
  for (let s = start; s < end; s++) {
    const v = fr(fr(f[k.specialDecay + s]! * f[k.specialState + s]!) + fr(f[k.specialGain + s]! * f[n[k.specialFluidCell + s]!]!));
    f[k.specialState + s] = v;
    f[n[k.specialTarget + s]!] = v;
  }
}

/** Start of row j of px (packed, see layout.ts). */
function pmlRowOffset(k: Context, j: number): number {
  return pmlPressureXRow(k.pmlPressureX, k.ny, k.stride, k.pmlCells, j);
}

/** Element offset of px at cell (i, j), or -1 where no PML damps that cell. */
function pmlCellOffset(k: Context, i: number, j: number): number {
  const row = pmlRowOffset(k, j);
  if (j < k.pmlBottom || j >= k.ny - k.pmlTop) return row + i;
  if (i < k.pmlLeft) return row + i;
  if (i >= k.nx - k.pmlRight) return row + k.pmlSideLeft + i - (k.nx - k.pmlRight);
  return -1;
}

function pressureRow(k: Context, j: number): void {
  const { f, nx, stride } = k;
  const p = k.pressure + j * stride;
  const vx = k.velocityX + j * stride;
  const vy = k.velocityY + j * stride;
  const vyAbove = vy + stride;
  if (k.levelMaps) accumulateLevels(f, k.d, p, k.peak + j * stride, k.squareSum + j * stride, nx);
  const pmlRow = j < k.pmlBottom || j >= k.ny - k.pmlTop;
  const iL = k.pmlLeft;
  const iR = nx - k.pmlRight;
  const px = k.hasPml ? pmlRowOffset(k, j) : -1;
  if (pmlRow) {
    const ay = f[k.rowCellDecay + j]!;
    const by = f[k.rowCellGain + j]!;
    if (iL > 0) pressureSplit(f, p, px, vx, vy, vyAbove, k.colCellDecay, k.colCellGain, 0, iL, ay, by);
    pressureSplitUniformX(f, p, px, vx, vy, vyAbove, iL, iR, k.decay, k.pressureGain, ay, by);
    if (iR < nx) pressureSplit(f, p, px, vx, vy, vyAbove, k.colCellDecay, k.colCellGain, iR, nx, ay, by);
  } else {
    // Packed side row: the left columns at px + i, the right ones from px + pmlSideLeft on.
    if (iL > 0) pressureSplit(f, p, px, vx, vy, vyAbove, k.colCellDecay, k.colCellGain, 0, iL, k.decay, k.pressureGain);
    if (k.heterogeneous) pressureField(f, p, vx, vy, vyAbove, k.cellGain + j * stride, iL, iR, k.decay);
    else pressureUniform(f, p, vx, vy, vyAbove, iL, iR, k.decay, k.pressureGain);
    if (iR < nx) pressureSplit(f, p, px + k.pmlSideLeft - iR, vx, vy, vyAbove, k.colCellDecay, k.colCellGain, iR, nx, k.decay, k.pressureGain);
  }
  // Solid cells behind an impedance face are held at zero so the solid interior stays silent.
  const { n } = k;
  const start = n[k.zeroRowStart + j]!;
  const end = n[k.zeroRowStart + j + 1]!;
  for (let s = start; s < end; s++) {
    const cell = n[k.zeroCell + s]!;
    f[k.pressure + cell] = 0;
    const split = k.hasPml ? pmlCellOffset(k, cell - j * stride, j) : -1;
    if (split >= 0) f[split] = 0;
  }
}

/** x = (x + flush) - flush in float32 over `count` values from `start`: tiny values to zero, the rest to the quantum. */
export function flushRow(f: Float32Array, start: number, count: number, flush: number): void {
  for (let i = start; i < start + count; i++) f[i] = fr(fr(f[i]! + flush) - flush);
}

function flushRows(k: Context, y0: number, y1: number): void {
  const { f, nx, stride } = k;
  for (let j = y0; j < y1; j++) {
    flushRow(f, k.pressure + j * stride, nx, k.flushPressure);
    if (k.hasPml) flushRow(f, pmlRowOffset(k, j), j < k.pmlBottom || j >= k.ny - k.pmlTop ? nx : k.pmlSideWidth, k.flushPressure);
    flushRow(f, k.velocityX + j * stride, nx + 1, k.flushVelocity);
    flushRow(f, k.velocityY + j * stride, nx, k.flushVelocity);
  }
  if (y1 === k.ny && y1 > y0) flushRow(f, k.velocityY + k.ny * stride, nx, k.flushVelocity);
}

/** The TypeScript reference kernel over a state buffer whose parameter block is already written. */
export function createTypeScriptKernel(buffer: ArrayBufferLike): StepKernel {
  const k = readContext(buffer);
  return {
    name: "typescript",
    sweepStrip(y0: number, y1: number): void {
      for (let j = y0; j < y1; j++) {
        velocityRow(k, j);
        boundaryFaces(k, j);
        // Pressure row j-1 now has all its velocities at n+1/2 (vy row j just written): update it while in cache.
        if (j > y0) pressureRow(k, j - 1);
      }
    },
    finishStrip(y0: number, y1: number): void {
      if (y1 > y0) pressureRow(k, y1 - 1);
    },
    flushStrip(y0: number, y1: number): void {
      flushRows(k, y0, y1);
    },
  };
}
