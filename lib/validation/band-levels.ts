// The query of the band-level CSV route: octave or one-third-octave bands, Z or A weighting.
import { z } from "zod";

export const bandLevelsQuerySchema = z.object({
  bandsPerOctave: z
    .enum(["1", "3"], { error: "bandsPerOctave is 1 (octave bands) or 3 (one-third-octave bands)." })
    .default("1")
    .transform((value) => (value === "3" ? 3 : 1) as 1 | 3),
  weighting: z.enum(["Z", "A"], { error: "weighting is Z (none) or A." }).default("Z"),
});
export type BandLevelsQuery = z.output<typeof bandLevelsQuerySchema>;
