// better-auth's configuration, shared by the running app (lib/server/auth.ts) and by the
// schema generator, which needs the options but no live database.
import type { BetterAuthOptions } from "better-auth";
import { organization } from "better-auth/plugins";
import { createAccessControl } from "better-auth/plugins/access";
import { defaultStatements, ownerAc } from "better-auth/plugins/organization/access";
import { minimumPasswordLength } from "@/lib/validation/password-policy";

/** Statements the organization plugin checks for its own endpoints (members, invitations). */
const teamAccessControl = createAccessControl(defaultStatements);

/** Only owners manage the team through the plugin; everything else is decided by lib/access/roles.ts. */
export const pluginRoles = {
  owner: teamAccessControl.newRole(ownerAc.statements),
  editor: teamAccessControl.newRole({ organization: [], member: [], invitation: [], team: [], ac: [] }),
  reviewer: teamAccessControl.newRole({ organization: [], member: [], invitation: [], team: [], ac: [] }),
  viewer: teamAccessControl.newRole({ organization: [], member: [], invitation: [], team: [], ac: [] }),
};


export function teamPlugin() {
  return organization({
    ac: teamAccessControl,
    roles: pluginRoles,
    creatorRole: "owner",
    // Teams are called teams in Rarefact; the plugin's tables are renamed to match.
    schema: {
      organization: { modelName: "team" },
      member: { modelName: "membership", fields: { organizationId: "teamId" } },
      invitation: { modelName: "invitation", fields: { organizationId: "teamId" } },
      session: { fields: { activeOrganizationId: "activeTeamId" } },
    },
  });
}

export function baseAuthOptions(): BetterAuthOptions {
  return {
    appName: "Rarefact",
    emailAndPassword: { enabled: true, minPasswordLength: minimumPasswordLength, maxPasswordLength: 128, autoSignIn: true },
    session: { expiresIn: 60 * 60 * 24 * 14, updateAge: 60 * 60 * 24 },
    plugins: [teamPlugin()],
  };
}
