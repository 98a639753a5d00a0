// Scenes the scene-editor tests start from, and a deep freeze that makes any mutation throw.
import { buildScene } from "@/lib/fdtd/builders";
import type { Scene } from "@/lib/fdtd/scene";

/** A barrier section: 20 m x 8 m of air, a ground block, a barrier, a lining, one source, receivers. */
export function barrierScene(): Scene {
  return buildScene({
    name: "Barrier section",
    domain: { width: 20, height: 8 },
    resolution: { kind: "frequency", maxFrequency: 500 },
    geometry: {
      solids: [{ id: "block", label: "Ground block", polygon: [{ x: 8, y: 0 }, { x: 9, y: 0 }, { x: 9, y: 1 }, { x: 8, y: 1 }] }],
      walls: [{ id: "barrier", label: "Barrier", path: [{ x: 10, y: 0 }, { x: 10, y: 3 }], thickness: 0.2 }],
      surfaces: [{ id: "lining", label: "Lining", path: [{ x: 12, y: 0 }, { x: 18, y: 0 }], treatment: { kind: "material", material: "grass-ground" } }],
    },
    boundary: { bottom: { kind: "rigid" } },
    sources: [{ id: "road", label: "Road", position: { x: 2, y: 0.5 }, signal: { kind: "ricker", peakFrequency: 180 } }],
    receivers: [{ id: "garden", label: "Garden", position: { x: 15, y: 1.5 } }],
    receiverLines: [{ id: "facade", label: "Facade", from: { x: 19, y: 0.5 }, to: { x: 19, y: 6 }, count: 12 }],
    duration: { kind: "time", seconds: 0.1 },
  });
}

/** Freezes every object and array reachable from `value`, so that writing to any of them throws (strict mode). */
export function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === "object" && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const child of Object.values(value as Record<string, unknown>)) deepFreeze(child);
  }
  return value;
}
