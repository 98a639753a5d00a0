// What the team routes accept: an invitation (e-mail and role), a role change, an invitation link's
// token. Shared by the invite form and the route handlers, so both say the same thing.
import { z } from "zod";
import { teamRoles } from "@/lib/access/roles";

export const teamRoleSchema = z.enum(teamRoles, { error: "Choose a role: owner, editor, reviewer or viewer." });

export const invitationInputSchema = z.object({
  email: z
    .string({ error: "Enter the e-mail address to invite." })
    .trim()
    .min(1, "Enter the e-mail address to invite.")
    .max(254, "An e-mail address has at most 254 characters.")
    .email("Enter a valid e-mail address, like name@example.com.")
    .transform((address) => address.toLowerCase()),
  role: teamRoleSchema,
});
export type InvitationInput = z.output<typeof invitationInputSchema>;
export type InvitationFormValues = z.input<typeof invitationInputSchema>;

export const roleChangeSchema = z.object({ role: teamRoleSchema });
export type RoleChangeInput = z.infer<typeof roleChangeSchema>;

/** An invitation link's secret: 32 random bytes in base64url (43 characters, no padding). */
export const invitationTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{43}$/, "This is not an invitation link.");
