// Scene builders shared by the solver's tests.
import { buildScene } from "@/lib/fdtd/builders";
import type { Scene, SceneInput } from "@/lib/fdtd/scene";

type EdgeInput = NonNullable<NonNullable<SceneInput["boundary"]>["left"]>;

export function allSides(edge: EdgeInput) {
  return { left: edge, right: edge, bottom: edge, top: edge };
}

/**
 * A unit medium (c = 1 m/s, rho = 1 kg/m^3) on 1 m cells with Courant number 0.5, so that the gains are
 * dt / (rho h) = rho c^2 dt / h = 0.5 and hand calculation stays simple. One silent source.
 */
export function unitGridScene(cellsX: number, cellsY: number, extra: Partial<SceneInput> = {}): Scene {
  return buildScene({
    domain: { width: cellsX, height: cellsY },
    medium: { kind: "fluid", soundSpeed: 1, density: 1 },
    resolution: { kind: "cellSize", cellSize: 1, courantNumber: 0.5 },
    boundary: allSides({ kind: "rigid" }),
    sources: [{ id: "silent", label: "silent", position: { x: 0.5, y: 0.5 }, amplitude: 0, signal: { kind: "ricker", peakFrequency: 0.1 } }],
    duration: { kind: "time", seconds: 100 },
    output: { levelMaps: false },
    ...extra,
  });
}

/**
 * A scene that exercises every code path of the kernel at once: PML on two sides, rigid and impedance
 * edges, a rigid solid, an absorbing solid, a thin wall, a lined surface, a medium region, attenuation,
 * level maps. Air, 2 cm cells.
 */
export function everyFeatureScene(): Scene {
  return buildScene({
    domain: { width: 1.2, height: 0.9 },
    resolution: { kind: "cellSize", cellSize: 0.02 },
    boundary: { left: { kind: "pml", layerCells: 8 }, top: { kind: "pml", layerCells: 10 }, right: { kind: "impedance", normalisedImpedance: 2 }, bottom: { kind: "rigid" } },
    mediumRegions: [{ id: "warm", label: "Warm air", polygon: [{ x: 0.7, y: 0.5 }, { x: 1.0, y: 0.5 }, { x: 1.0, y: 0.8 }, { x: 0.7, y: 0.8 }], medium: { kind: "air", temperature: 60 } }],
    geometry: {
      solids: [
        { id: "block", label: "Block", polygon: [{ x: 0.2, y: 0 }, { x: 0.35, y: 0 }, { x: 0.35, y: 0.2 }, { x: 0.2, y: 0.2 }] },
        { id: "absorber", label: "Absorber", polygon: [{ x: 0.8, y: 0.1 }, { x: 0.95, y: 0.15 }, { x: 0.85, y: 0.3 }], surface: { kind: "absorption", absorptionCoefficient: 0.6 } },
      ],
      walls: [{ id: "screen", label: "Screen", path: [{ x: 0.55, y: 0 }, { x: 0.6, y: 0.45 }], thickness: 0.005 }],
      surfaces: [{ id: "lining", label: "Lining", path: [{ x: 0.0, y: 0.0 }, { x: 0.2, y: 0.0 }], treatment: { kind: "material", material: "carpet-on-concrete" } }],
    },
    sources: [{ id: "s", label: "Source", position: { x: 0.41, y: 0.35 }, signal: { kind: "ricker", peakFrequency: 1200 } }],
    receivers: [{ id: "r", label: "Receiver", position: { x: 0.75, y: 0.2 } }],
    receiverLines: [{ id: "line", label: "Line", from: { x: 0.1, y: 0.6 }, to: { x: 1.1, y: 0.6 }, count: 5 }],
    attenuation: { dBPerMetre: 0.5 },
    duration: { kind: "time", seconds: 0.004 },
    output: { levelMaps: true, snapshotEverySteps: 50, snapshotCellStride: 2 },
  });
}
