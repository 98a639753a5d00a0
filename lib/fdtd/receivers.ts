// Receivers: bilinear interpolation of pressure from the four nearest cell centres and of each velocity
// component from its own staggered lattice (the velocity the scheme integrates from Euler's relation,
// rho dv/dt = -grad p). Solid cells and their faces are left out of the interpolation.
import type { GridPlan } from "./grid";
import type { RasterisedScene } from "./rasterise";
import type { Point, Scene } from "./scene";

export interface ReceiverSpec {
  id: string;
  label: string;
  position: Point;
  /** Id of the receiver line it belongs to, if any. */
  lineId?: string;
}

/** Up to four (offset, weight) pairs, offsets relative to the start of a field array. */
export interface Stencil {
  offsets: Int32Array;
  weights: Float64Array;
}

export interface PlacedReceiver extends ReceiverSpec {
  pressure: Stencil;
  velocityX: Stencil;
  velocityY: Stencil;
}

/** Point receivers, then the receivers of each line (ids `line[k]`, evenly spaced, both ends included). */
export function receiverSpecs(scene: Scene): ReceiverSpec[] {
  const specs: ReceiverSpec[] = scene.receivers.map((r) => ({ id: r.id, label: r.label, position: r.position }));
  for (const line of scene.receiverLines) {
    for (let k = 0; k < line.count; k++) {
      const t = k / (line.count - 1);
      specs.push({
        id: `${line.id}[${k}]`,
        label: `${line.label} ${k + 1}`,
        position: { x: line.from.x + t * (line.to.x - line.from.x), y: line.from.y + t * (line.to.y - line.from.y) },
        lineId: line.id,
      });
    }
  }
  return specs;
}

/**
 * Bilinear stencil on a lattice whose node (a, b) sits at scene position (x0 + a h, y0 + b h),
 * a in [0, na), b in [0, nb), stored at offset b * stride + a. `usable` says whether a node may be used.
 */
function bilinearStencil(x: number, y: number, x0: number, y0: number, h: number, na: number, nb: number, stride: number, usable: (a: number, b: number) => boolean): Stencil {
  const u = Math.min(na - 1, Math.max(0, (x - x0) / h));
  const v = Math.min(nb - 1, Math.max(0, (y - y0) / h));
  const a = Math.min(na - 2, Math.floor(u));
  const b = Math.min(nb - 2, Math.floor(v));
  const fu = u - a;
  const fv = v - b;
  const nodes: [number, number, number][] = [
    [a, b, (1 - fu) * (1 - fv)],
    [a + 1, b, fu * (1 - fv)],
    [a, b + 1, (1 - fu) * fv],
    [a + 1, b + 1, fu * fv],
  ];
  const kept = nodes.filter(([na2, nb2, w]) => w > 0 && na2 >= 0 && nb2 >= 0 && usable(na2, nb2));
  const total = kept.reduce((s, [, , w]) => s + w, 0);
  if (total <= 0) return { offsets: new Int32Array(0), weights: new Float64Array(0) };
  return {
    offsets: Int32Array.from(kept.map(([p, q]) => q * stride + p)),
    weights: Float64Array.from(kept.map(([, , w]) => w / total)),
  };
}

export function placeReceivers(specs: readonly ReceiverSpec[], grid: GridPlan, raster: RasterisedScene, stride: number): PlacedReceiver[] {
  const { nx, ny, cellSize: h, originX, originY } = grid;
  const fluid = (i: number, j: number) => i >= 0 && j >= 0 && i < nx && j < ny && raster.solid[j * nx + i] === 0;
  return specs.map((spec) => {
    const { x, y } = spec.position;
    // Cell centres: node (i, j) at (originX + (i + 1/2) h, originY + (j + 1/2) h).
    const pressure = bilinearStencil(x, y, originX + 0.5 * h, originY + 0.5 * h, h, nx, ny, stride, fluid);
    // x-faces: node (i, j) at (originX + i h, originY + (j + 1/2) h), usable when a fluid cell touches it.
    const velocityX = bilinearStencil(x, y, originX, originY + 0.5 * h, h, nx + 1, ny, stride, (i, j) => fluid(i - 1, j) || fluid(i, j));
    // y-faces: node (i, j) at (originX + (i + 1/2) h, originY + j h).
    const velocityY = bilinearStencil(x, y, originX + 0.5 * h, originY, h, nx, ny + 1, stride, (i, j) => fluid(i, j - 1) || fluid(i, j));
    return { ...spec, pressure, velocityX, velocityY };
  });
}

/** Value of a field at a stencil: sum of weight * field[base + offset]. */
export function sampleStencil(field: Float32Array, base: number, stencil: Stencil): number {
  let sum = 0;
  for (let k = 0; k < stencil.offsets.length; k++) sum += stencil.weights[k]! * field[base + stencil.offsets[k]!]!;
  return sum;
}
