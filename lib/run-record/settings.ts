// How a run's result is kept: how many snapshot frames, how fine, how fine the maps. These change
// what a saved run holds, so they are part of the run's input (and of its hash) beside the scene.
import { z } from "zod";
import { MAX_MAP_VALUES, MAX_SNAPSHOT_FRAME_VALUES, MAX_SNAPSHOT_FRAMES, MAX_SNAPSHOT_VALUES } from "./limits";

export const runSettingsSchema = z
  .object({
    snapshotFrameLimit: z
      .number()
      .int("snapshotFrameLimit is a whole number of frames")
      .min(1, "keep at least one snapshot frame")
      .max(MAX_SNAPSHOT_FRAMES, `at most ${MAX_SNAPSHOT_FRAMES} snapshot frames are kept`)
      .describe("snapshot frames kept at most; more are thinned in time"),
    snapshotFrameValueLimit: z
      .number()
      .int("snapshotFrameValueLimit is a whole number of values")
      .min(1024, "a snapshot frame of fewer than 1024 values shows nothing")
      .max(MAX_SNAPSHOT_FRAME_VALUES, `a snapshot frame holds at most ${MAX_SNAPSHOT_FRAME_VALUES} values`)
      .describe("values per snapshot frame at most; larger frames keep every s-th cell"),
    mapValueLimit: z
      .number()
      .int("mapValueLimit is a whole number of values")
      .min(1024, "a map of fewer than 1024 values shows nothing")
      .max(MAX_MAP_VALUES, `a level map holds at most ${MAX_MAP_VALUES} values`)
      .describe("values per level or intensity map at most; larger maps are coarsened into blocks"),
  })
  .strict()
  .refine((settings) => settings.snapshotFrameLimit * settings.snapshotFrameValueLimit <= MAX_SNAPSHOT_VALUES, {
    message: `snapshotFrameLimit x snapshotFrameValueLimit may be at most ${MAX_SNAPSHOT_VALUES}`,
    path: ["snapshotFrameLimit"],
  });

export type RunSettings = z.output<typeof runSettingsSchema>;

/** Enough frames for a smooth replay and enough cells to see the geometry, at a few tens of MB at most. */
export const defaultRunSettings: RunSettings = {
  snapshotFrameLimit: 120,
  snapshotFrameValueLimit: 128 * 1024,
  mapValueLimit: 1024 * 1024,
};
