// Where every array of a simulation's state lives inside one buffer. The buffer can be a plain
// ArrayBuffer, a caller-supplied SharedArrayBuffer (several workers stepping strips of one grid) or a
// WebAssembly memory (the SIMD kernel): the TypeScript and WebAssembly kernels read the same layout.
//
// Grids are row-major with the x index i running fastest: element (i, j) of a field is at
// offset + j * stride + i. Offsets below are in elements of the array's own type (4 bytes for
// Float32/Int32, 8 bytes for Float64), counted from the start of the buffer.

/** Bytes kept free at the start of the buffer for the WebAssembly module's own data. */
export const RESERVED_BYTES = 65_536;

/** Bytes between consecutive arrays (see planLayout). */
const ARRAY_GAP_BYTES = 1040;

/** Row length in elements: nx + 1 (room for the last x-face), rounded up to 4 floats (16 bytes, one SIMD vector). */
export function rowStride(nx: number): number {
  return Math.ceil((nx + 1) / 4) * 4;
}

export interface LayoutRequest {
  nx: number;
  ny: number;
  /** Any side has a PML: allocates the split pressure and the damping tables. */
  hasPml: boolean;
  /**
   * PML thickness in cells per side. The split pressure is kept only where a PML damps along x or y
   * (see pmlPressureXRow); without these sizes a full grid's worth is reserved, an upper bound good
   * for memory estimates, and kernels still run on it.
   */
  pmlCells?: PmlCells;
  /** Medium regions present: per-cell and per-face coefficients instead of one scalar. */
  heterogeneous: boolean;
  /** Per-cell running peak and mean-square pressure. */
  levelMaps: boolean;
  /** Velocity faces with a boundary condition (rigid or impedance), over all rows. */
  specialFaceCount: number;
  /** Solid cells whose pressure must be held at zero (they border an impedance face). */
  zeroCellCount: number;
}

export interface PmlCells {
  left: number;
  right: number;
  bottom: number;
  top: number;
}

/**
 * Floats kept per row of the split pressure in a row outside the bottom and top PMLs: the left PML
 * columns rounded up to 4 floats (so that the right part starts 16-byte aligned), then the right ones.
 */
export function pmlSideRowWidth(pml: PmlCells): number {
  return pmlSideLeftWidth(pml) + Math.ceil(pml.right / 4) * 4;
}

/** Offset of the right PML columns inside a side row of the split pressure. */
export function pmlSideLeftWidth(pml: PmlCells): number {
  return Math.ceil(pml.left / 4) * 4;
}

/**
 * Element offset of row j of the split pressure's x part px, which exists only inside the PML. Rows of
 * the bottom and top PMLs are whole (`stride` floats, px[j][i] at row + i); every other row holds only
 * its side columns, packed (`pmlSideRowWidth` floats: px[j][i] at row + i for i < left and at
 * row + pmlSideLeftWidth + i - (nx - right) for i >= nx - right). Packing keeps the few side values
 * of consecutive rows in consecutive cache lines instead of one scattered line per row.
 */
export function pmlPressureXRow(base: number, ny: number, stride: number, pml: PmlCells, j: number): number {
  const interiorRows = ny - pml.bottom - pml.top;
  if (j < pml.bottom) return base + j * stride;
  if (j < ny - pml.top) return base + pml.bottom * stride + (j - pml.bottom) * pmlSideRowWidth(pml);
  return base + pml.bottom * stride + interiorRows * pmlSideRowWidth(pml) + (j - (ny - pml.top)) * stride;
}

/** Floats of the packed split pressure (see pmlPressureXRow). */
export function pmlPressureXLength(ny: number, stride: number, pml: PmlCells): number {
  return (pml.bottom + pml.top) * stride + (ny - pml.bottom - pml.top) * pmlSideRowWidth(pml);
}

export interface StateLayout extends LayoutRequest {
  stride: number;
  /** Total bytes of the buffer. */
  byteLength: number;
  // Float32 offsets (in 4-byte elements)
  pressure: number;
  velocityX: number;
  velocityY: number;
  /** x part of the split pressure inside the PML (p = px + py), rows packed as in pmlPressureXRow; -1 without PML. */
  pmlPressureX: number;
  /** Per-column damping tables, `stride` long each: cell decay, cell gain, x-face decay, x-face gain; -1 without PML. */
  pmlColumns: number;
  /** Per-row damping tables, `ny + 1` long each: cell decay, cell gain, y-face decay, y-face gain; -1 without PML. */
  pmlRows: number;
  /** Per-cell K dt / h, per-x-face and per-y-face dt / (rho h); -1 when homogeneous. */
  cellGain: number;
  faceGainX: number;
  faceGainY: number;
  /** Running peak |p| per cell (Float32); -1 without level maps. */
  peakPressure: number;
  /** Running sum of p^2 per cell, Float64 offset (8-byte elements); -1 without level maps. */
  pressureSquareSum: number;
  /** Special faces, compressed by sweep row: Int32 row starts (ny + 1), Int32 target, Int32 fluid cell, Float32 decay, gain, state. */
  specialRowStart: number;
  specialTarget: number;
  specialFluidCell: number;
  specialDecay: number;
  specialGain: number;
  specialState: number;
  /** Cells held at zero, by row: Int32 row starts (ny + 1), Int32 cell offsets. */
  zeroRowStart: number;
  zeroCell: number;
}

/** Lays out every array, 16-byte aligned, after the reserved bytes. */
export function planLayout(request: LayoutRequest): StateLayout {
  const { nx, ny } = request;
  const stride = rowStride(nx);
  let cursor = RESERVED_BYTES;
  const take = (bytes: number): number => {
    const at = cursor;
    // The gap staggers arrays of equal size across 4 KiB pages: without it p[j][i], vx[j][i] and vy[j][i]
    // share their low 12 address bits, and loads after stores to them stall on 4K aliasing.
    cursor += Math.ceil(bytes / 16) * 16 + ARRAY_GAP_BYTES;
    return at;
  };
  const f32 = (count: number) => take(4 * count) / 4;
  const f64 = (count: number) => take(8 * count) / 8;
  const cells = ny * stride;
  const pressure = f32(cells);
  const velocityX = f32(cells);
  const velocityY = f32((ny + 1) * stride);
  const pmlPressureX = request.hasPml ? f32(request.pmlCells ? pmlPressureXLength(ny, stride, request.pmlCells) : cells) : -1;
  const pmlColumns = request.hasPml ? f32(4 * stride) : -1;
  const pmlRows = request.hasPml ? f32(4 * (ny + 1)) : -1;
  const cellGain = request.heterogeneous ? f32(cells) : -1;
  const faceGainX = request.heterogeneous ? f32(cells) : -1;
  const faceGainY = request.heterogeneous ? f32((ny + 1) * stride) : -1;
  const peakPressure = request.levelMaps ? f32(cells) : -1;
  const pressureSquareSum = request.levelMaps ? f64(cells) : -1;
  const specialRowStart = f32(ny + 1);
  const specialTarget = f32(request.specialFaceCount);
  const specialFluidCell = f32(request.specialFaceCount);
  const specialDecay = f32(request.specialFaceCount);
  const specialGain = f32(request.specialFaceCount);
  const specialState = f32(request.specialFaceCount);
  const zeroRowStart = f32(ny + 1);
  const zeroCell = f32(request.zeroCellCount);
  return {
    ...request,
    stride,
    byteLength: cursor,
    pressure,
    velocityX,
    velocityY,
    pmlPressureX,
    pmlColumns,
    pmlRows,
    cellGain,
    faceGainX,
    faceGainY,
    peakPressure,
    pressureSquareSum,
    specialRowStart,
    specialTarget,
    specialFluidCell,
    specialDecay,
    specialGain,
    specialState,
    zeroRowStart,
    zeroCell,
  };
}
