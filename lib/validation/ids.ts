import { z } from "zod";

/** Ids are UUIDs; anything else is a bad request, not a lookup. */
export const idSchema = z.string().uuid("Not a valid id.");
