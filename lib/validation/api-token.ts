// Personal API tokens: what making one takes (shared by the settings form and the route) and what a
// token's secret looks like, so a malformed Authorization header is refused before any lookup.
import { z } from "zod";
import { idSchema } from "./ids";
import { teamRoleSchema } from "./team";

/** Longest lifetime a token may be given; leaving the expiry out makes a token that never expires. */
export const apiTokenMaxDays = 366;

export const apiTokenCreateSchema = z.object({
  name: z
    .string({ error: "Give the token a name." })
    .trim()
    .min(1, "Give the token a name, e.g. the script or machine that uses it.")
    .max(80, "A token name can be at most 80 characters."),
  teamId: idSchema,
  role: teamRoleSchema,
  expiresInDays: z
    .number({ error: "expiresInDays is a number of days." })
    .int("Give a whole number of days.")
    .min(1, "A token lasts at least 1 day.")
    .max(apiTokenMaxDays, `A token lasts at most ${apiTokenMaxDays} days.`)
    .optional(),
});
export type ApiTokenCreateInput = z.infer<typeof apiTokenCreateSchema>;

/** "rft_" and 32 random bytes in base64url without padding (43 characters). */
export const apiTokenSecretPattern = /^rft_[A-Za-z0-9_-]{43}$/;
export const apiTokenSecretSchema = z.string().regex(apiTokenSecretPattern, "Not a Rarefact API token.");
