// Parameter sweeps: one scene parameter stepped over a range, every value a complete scene of its
// own, run like any other and compared through its insertion loss. Each parameter names what it moves
// in the engineer's terms (barrier height, receiver height, ...), not as a JSON path.
import { parseScene, type Scene } from "@/lib/fdtd/scene";

/** Cases in one sweep at most: each is a full run. */
export const MAX_SWEEP_CASES = 25;

export type SweepParameter =
  /** Height of a wall's top above its lowest point: the highest vertices move vertically. */
  | { kind: "wall-height"; wallId: string }
  /** Horizontal position of a whole wall, by its lowest point's x. */
  | { kind: "wall-position"; wallId: string }
  /** Height (y) of a receiver. */
  | { kind: "receiver-height"; receiverId: string }
  /** Height (y) of a source. */
  | { kind: "source-height"; sourceId: string }
  /** Normal-incidence absorption coefficient of a wall's faces. */
  | { kind: "wall-absorption"; wallId: string };

export interface SweepRange {
  from: number;
  to: number;
  step: number;
}

export interface SweepCase {
  value: number;
  scene: Scene;
}

export type SweepResult = { ok: true; cases: SweepCase[] } | { ok: false; message: string };

/** What the parameter is called and measured in, for labels and axes. */
export function describeParameter(scene: Scene, parameter: SweepParameter): { label: string; unit: string } {
  const name = (list: { id: string; label: string }[], id: string) => {
    const found = list.find((item) => item.id === id);
    return found ? found.label || found.id : id;
  };
  switch (parameter.kind) {
    case "wall-height":
      return { label: `height of ${name(scene.geometry.walls, parameter.wallId)}`, unit: "m" };
    case "wall-position":
      return { label: `position of ${name(scene.geometry.walls, parameter.wallId)}`, unit: "m" };
    case "receiver-height":
      return { label: `height of ${name(scene.receivers, parameter.receiverId)}`, unit: "m" };
    case "source-height":
      return { label: `height of ${name(scene.sources, parameter.sourceId)}`, unit: "m" };
    case "wall-absorption":
      return { label: `absorption coefficient of ${name(scene.geometry.walls, parameter.wallId)}`, unit: "" };
  }
}

/** The values of a range, both ends included; rounding keeps 2.5 from becoming 2.4999999999999996. */
export function sweepValues(range: SweepRange): { ok: true; values: number[] } | { ok: false; message: string } {
  const { from, to, step } = range;
  if (![from, to, step].every(Number.isFinite)) return { ok: false, message: "from, to and step must be numbers" };
  if (step <= 0) return { ok: false, message: "the step must be greater than zero" };
  if (to < from) return { ok: false, message: "'to' must not be below 'from'" };
  const count = Math.floor((to - from) / step + 1e-9) + 1;
  if (count < 2) return { ok: false, message: "a sweep needs at least two values: widen the range or shorten the step" };
  if (count > MAX_SWEEP_CASES) return { ok: false, message: `${count} cases: a sweep runs at most ${MAX_SWEEP_CASES}; lengthen the step` };
  return { ok: true, values: Array.from({ length: count }, (_, k) => Number((from + k * step).toPrecision(12))) };
}

type Change = { ok: true; scene: Scene } | { ok: false; message: string };

function changeWall(scene: Scene, wallId: string, change: (wall: Scene["geometry"]["walls"][number]) => Scene["geometry"]["walls"][number]): Change {
  if (!scene.geometry.walls.some((wall) => wall.id === wallId)) return { ok: false, message: `no wall with id "${wallId}"` };
  return {
    ok: true,
    scene: { ...scene, geometry: { ...scene.geometry, walls: scene.geometry.walls.map((wall) => (wall.id === wallId ? change(wall) : wall)) } },
  };
}

function moveY<T extends { id: string; position: { x: number; y: number } }>(items: T[], id: string, y: number, what: string): { ok: true; items: T[] } | { ok: false; message: string } {
  if (!items.some((item) => item.id === id)) return { ok: false, message: `no ${what} with id "${id}"` };
  return { ok: true, items: items.map((item) => (item.id === id ? { ...item, position: { ...item.position, y } } : item)) };
}

/** The scene with the parameter set to `value` (not yet validated). */
export function applyParameter(scene: Scene, parameter: SweepParameter, value: number): Change {
  switch (parameter.kind) {
    case "wall-height":
      if (value <= 0) return { ok: false, message: "a wall height must be greater than zero" };
      return changeWall(scene, parameter.wallId, (wall) => {
        const base = Math.min(...wall.path.map((point) => point.y));
        const top = Math.max(...wall.path.map((point) => point.y));
        return { ...wall, path: wall.path.map((point) => (point.y === top ? { ...point, y: base + value } : point)) };
      });
    case "wall-position":
      return changeWall(scene, parameter.wallId, (wall) => {
        const lowest = wall.path.reduce((a, b) => (b.y < a.y ? b : a));
        const shift = value - lowest.x;
        return { ...wall, path: wall.path.map((point) => ({ ...point, x: point.x + shift })) };
      });
    case "wall-absorption":
      if (value < 0 || value > 1) return { ok: false, message: "an absorption coefficient lies between 0 and 1" };
      return changeWall(scene, parameter.wallId, (wall) => ({ ...wall, surface: { kind: "absorption", absorptionCoefficient: value } }));
    case "receiver-height": {
      const moved = moveY(scene.receivers, parameter.receiverId, value, "receiver");
      return moved.ok ? { ok: true, scene: { ...scene, receivers: moved.items } } : moved;
    }
    case "source-height": {
      const moved = moveY(scene.sources, parameter.sourceId, value, "source");
      return moved.ok ? { ok: true, scene: { ...scene, sources: moved.items } } : moved;
    }
  }
}

/** Every case of a sweep as a valid scene, or the first value that makes an invalid one and why. */
export function sweepScenes(scene: Scene, parameter: SweepParameter, range: SweepRange): SweepResult {
  const values = sweepValues(range);
  if (!values.ok) return values;
  const { label, unit } = describeParameter(scene, parameter);
  const cases: SweepCase[] = [];
  for (const value of values.values) {
    const changed = applyParameter(scene, parameter, value);
    if (!changed.ok) return { ok: false, message: `${label} = ${value}${unit ? ` ${unit}` : ""}: ${changed.message}` };
    const named = { ...changed.scene, name: `${scene.name || "Scene"} (${label} = ${value}${unit ? ` ${unit}` : ""})`.slice(0, 200) };
    const parsed = parseScene(named);
    if (!parsed.ok) {
      const problem = parsed.problems[0]!;
      return { ok: false, message: `${label} = ${value}${unit ? ` ${unit}` : ""} makes an invalid scene: ${problem.path || "(scene)"}: ${problem.message}` };
    }
    cases.push({ value, scene: parsed.scene });
  }
  return { ok: true, cases };
}
