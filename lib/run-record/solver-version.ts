// The version of the solver whose results are saved. Two runs with equal input hashes have equal
// results only on one solver version, so the version is stored with every run.
import { SCENE_VERSION } from "@/lib/fdtd/scene";

/**
 * Raise the number whenever a change to lib/fdtd alters any result value (kernel arithmetic,
 * source injection, receiver interpolation, level maps, grid derivation). The scene format
 * version is part of the string because it decides how a scene is read.
 */
export const SOLVER_VERSION = `rarefact-fdtd-2d/1 (scene format ${SCENE_VERSION})`;
