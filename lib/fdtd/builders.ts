// Small helpers to build scenes in code (tests, verification cases, scripts) and to read results.
import { parseSceneOrThrow, SCENE_VERSION, type Scene, type SceneInput } from "./scene";

type SignalInput = SceneInput["sources"][number]["signal"];

/** A point source entry; `amplitude` is the peak volume rate per unit length Q in m^2/s. */
export function pointSource(id: string, x: number, y: number, signal: SignalInput, amplitude = 1): SceneInput["sources"][number] {
  return { id, label: id, position: { x, y }, signal, amplitude };
}

/** A point receiver entry. */
export function pointReceiver(id: string, x: number, y: number): NonNullable<SceneInput["receivers"]>[number] {
  return { id, label: id, position: { x, y } };
}

/**
 * A valid scene from the parts that matter; everything else takes its default (air at 20 C, PML on
 * every side, Courant number 0.6, level maps on). Throws listing every problem if the parts are invalid.
 */
export function buildScene(parts: Omit<SceneInput, "version"> & { version?: number }): Scene {
  return parseSceneOrThrow({ ...parts, version: parts.version ?? SCENE_VERSION });
}

/** Sample times n * timeStep of a trace of `length` samples, s. */
export function traceTimes(length: number, timeStep: number): Float64Array {
  const times = new Float64Array(length);
  for (let n = 0; n < length; n++) times[n] = n * timeStep;
  return times;
}
