// The parameter block both kernels (TypeScript and WebAssembly) read at the start of each call: a few
// integers and floats at a fixed place in the state buffer, inside its reserved bytes.
// lib/fdtd/wasm/assembly/kernel.ts repeats these numbers; a test checks that they agree.
import type { StateLayout } from "./layout";

/** Byte offset of the parameter block in the state buffer. */
export const PARAMS_BYTE_OFFSET = 1024;

/** Int32 slots (index from PARAMS_BYTE_OFFSET / 4). */
export const P_NX = 0;
export const P_NY = 1;
export const P_STRIDE = 2;
/** PML thickness in cells on each side. */
export const P_PML_LEFT = 3;
export const P_PML_RIGHT = 4;
export const P_PML_BOTTOM = 5;
export const P_PML_TOP = 6;
/** Array offsets, as in StateLayout. */
export const P_PRESSURE = 7;
export const P_VELOCITY_X = 8;
export const P_VELOCITY_Y = 9;
export const P_PML_PRESSURE_X = 10;
export const P_PML_COLUMNS = 11;
export const P_PML_ROWS = 12;
export const P_CELL_GAIN = 13;
export const P_FACE_GAIN_X = 14;
export const P_FACE_GAIN_Y = 15;
export const P_PEAK_PRESSURE = 16;
export const P_PRESSURE_SQUARE_SUM = 17;
export const P_SPECIAL_ROW_START = 18;
export const P_SPECIAL_TARGET = 19;
export const P_SPECIAL_FLUID_CELL = 20;
export const P_SPECIAL_DECAY = 21;
export const P_SPECIAL_GAIN = 22;
export const P_SPECIAL_STATE = 23;
export const P_ZERO_ROW_START = 24;
export const P_ZERO_CELL = 25;
/** Bit 0: heterogeneous medium; bit 1: level maps; bit 2: PML present. */
export const P_FLAGS = 26;

/** Float32 slots. */
export const P_DECAY = 32;
export const P_VELOCITY_GAIN = 33;
export const P_PRESSURE_GAIN = 34;
export const P_FLUSH_PRESSURE = 35;
export const P_FLUSH_VELOCITY = 36;

export const PARAM_SLOTS = 40;

export const FLAG_HETEROGENEOUS = 1;
export const FLAG_LEVEL_MAPS = 2;
export const FLAG_PML = 4;

/** Scalars of the uniform update, already rounded to float32 by the writer. */
export interface KernelScalars {
  /** (1 - sigma0 dt / 2) / (1 + sigma0 dt / 2): ad hoc attenuation per step; 1 when lossless. */
  decay: number;
  /** dt / (rho h) / (1 + sigma0 dt / 2), m^2 s / kg. */
  velocityGain: number;
  /** rho c^2 dt / h / (1 + sigma0 dt / 2), Pa s / m. */
  pressureGain: number;
  /** Offsets of the subnormal flush (x + F) - F for pressure (Pa) and velocity (m/s). */
  flushPressure: number;
  flushVelocity: number;
}

/** Writes the parameter block for a layout. */
export function writeKernelParams(buffer: ArrayBufferLike, layout: StateLayout, pml: { left: number; right: number; bottom: number; top: number }, scalars: KernelScalars): void {
  const i32 = new Int32Array(buffer, PARAMS_BYTE_OFFSET, PARAM_SLOTS);
  const f32 = new Float32Array(buffer, PARAMS_BYTE_OFFSET, PARAM_SLOTS);
  i32[P_NX] = layout.nx;
  i32[P_NY] = layout.ny;
  i32[P_STRIDE] = layout.stride;
  i32[P_PML_LEFT] = pml.left;
  i32[P_PML_RIGHT] = pml.right;
  i32[P_PML_BOTTOM] = pml.bottom;
  i32[P_PML_TOP] = pml.top;
  i32[P_PRESSURE] = layout.pressure;
  i32[P_VELOCITY_X] = layout.velocityX;
  i32[P_VELOCITY_Y] = layout.velocityY;
  i32[P_PML_PRESSURE_X] = layout.pmlPressureX;
  i32[P_PML_COLUMNS] = layout.pmlColumns;
  i32[P_PML_ROWS] = layout.pmlRows;
  i32[P_CELL_GAIN] = layout.cellGain;
  i32[P_FACE_GAIN_X] = layout.faceGainX;
  i32[P_FACE_GAIN_Y] = layout.faceGainY;
  i32[P_PEAK_PRESSURE] = layout.peakPressure;
  i32[P_PRESSURE_SQUARE_SUM] = layout.pressureSquareSum;
  i32[P_SPECIAL_ROW_START] = layout.specialRowStart;
  i32[P_SPECIAL_TARGET] = layout.specialTarget;
  i32[P_SPECIAL_FLUID_CELL] = layout.specialFluidCell;
  i32[P_SPECIAL_DECAY] = layout.specialDecay;
  i32[P_SPECIAL_GAIN] = layout.specialGain;
  i32[P_SPECIAL_STATE] = layout.specialState;
  i32[P_ZERO_ROW_START] = layout.zeroRowStart;
  i32[P_ZERO_CELL] = layout.zeroCell;
  i32[P_FLAGS] = (layout.heterogeneous ? FLAG_HETEROGENEOUS : 0) | (layout.levelMaps ? FLAG_LEVEL_MAPS : 0) | (layout.hasPml ? FLAG_PML : 0);
  f32[P_DECAY] = scalars.decay;
  f32[P_VELOCITY_GAIN] = scalars.velocityGain;
  f32[P_PRESSURE_GAIN] = scalars.pressureGain;
  f32[P_FLUSH_PRESSURE] = scalars.flushPressure;
  f32[P_FLUSH_VELOCITY] = scalars.flushVelocity;
}
