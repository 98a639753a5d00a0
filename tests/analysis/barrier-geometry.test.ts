// Barrier geometry read from a frozen scene: the demo barrier's top edge, a flat-topped solid's two
// corners, and per-receiver estimates with a reason where the barrier is not between source and receiver.
import { describe, expect, it } from "vitest";

import { barrierCandidates, barrierEstimatesPerReceiver, likelyBarrier, standsBetween } from "@/lib/analysis/barrier-geometry";
import { maekawaAttenuation } from "@/lib/analysis/barrier-estimates";
import { nearestSource } from "@/lib/analysis/source-distance";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";

import demoScene from "../../db/seed/scenes/design-a-3m-reflective.json";

const scene = parseSceneOrThrow(demoScene);
const source = { x: scene.sources[0]!.position.x, y: scene.sources[0]!.position.y };

describe("barrier candidates from a scene", () => {
  const candidates = barrierCandidates(scene);

  it("lists walls before solids, a thin wall with one edge at its highest point", () => {
    expect(candidates.map((c) => c.id)).toEqual(["barrier", "house-east", "road-verge"]);
    expect(candidates[0]).toMatchObject({ kind: "wall", label: "Timber barrier, 3.0 m", edges: [{ x: 12.5, y: 3.4 }] });
  });

  it("gives a flat-topped solid its two top corners, left to right", () => {
    expect(candidates[1]!.edges).toEqual([
      { x: 44, y: 7.5 },
      { x: 50, y: 7.5 },
    ]);
  });

  it("picks the wall that stands between the source and the receivers as the likely barrier", () => {
    const receivers = scene.receivers.map((r) => r.position);
    expect(likelyBarrier(candidates, source, receivers)?.id).toBe("barrier");
    expect(standsBetween(candidates[1]!, source, { x: 43, y: 1.5 })).toBe(false);
  });
});

describe("estimates per receiver", () => {
  const barrier = barrierCandidates(scene)[0]!;

  it("computes the path difference over the top edge and Maekawa's value from it", () => {
    const garden = { id: "garden", label: "Garden", x: 28, y: 1.5 };
    const [result] = barrierEstimatesPerReceiver(barrier, source, [garden]);
    if (!result?.ok) throw new Error("expected estimates");
    // Path difference by hand: |S E| + |E R| - |S R| with S (4.5, 0.9), E (12.5, 3.4), R (28, 1.5).
    const expected = Math.hypot(8, 2.5) + Math.hypot(15.5, 1.9) - Math.hypot(23.5, 0.6);
    expect(result.estimates.path.zone).toBe("shadow");
    expect(result.estimates.path.pathDifference).toBeCloseTo(expected, 12);
    const octave500 = result.estimates.bands.find((b) => b.band.nominal === 500)!;
    expect(octave500.fresnelNumber).toBeCloseTo((2 * expected) / (340 / 500), 12);
    expect(octave500.maekawa).toBeCloseTo(maekawaAttenuation(octave500.fresnelNumber), 12);
  });

  it("says why when the barrier is not between the source and the receiver", () => {
    const [result] = barrierEstimatesPerReceiver(barrier, source, [{ id: "near", label: "Kerb", x: 8, y: 1.5 }]);
    expect(result).toMatchObject({ ok: false, reason: "Timber barrier, 3.0 m does not stand between the source and this receiver" });
  });
});

describe("distance for air absorption", () => {
  it("takes the nearest source and none when there is no source", () => {
    const sources = [
      { id: "far", label: "Far lane", x: 0, y: 1 },
      { id: "near", label: "Near lane", x: 4, y: 1 },
    ];
    expect(nearestSource({ x: 7, y: 5 }, sources)).toEqual({ source: sources[1], distance: 5 });
    expect(nearestSource({ x: 7, y: 5 }, [])).toBeUndefined();
  });
});
