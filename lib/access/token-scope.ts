// How far a personal API token reaches. A token names a team and a role; at each call it may do no
// more than that role allows and no more than its owner's current role in the team allows. Roles are
// not a ladder (an editor edits but does not sign off; a reviewer signs off but does not edit), so
// "no higher" means "every action of the one is an action of the other".
import { permissionsByRole, teamRoles, type TeamRole } from "./roles";

/** Whether every action `role` permits is also permitted to `ceiling`. */
export function roleWithin(role: TeamRole, ceiling: TeamRole): boolean {
  const allowed = permissionsByRole[ceiling];
  for (const action of permissionsByRole[role]) if (!allowed.has(action)) return false;
  return true;
}

/** The roles a member with `memberRole` may give a token, most permissive first. */
export function tokenRolesFor(memberRole: TeamRole): TeamRole[] {
  return teamRoles.filter((role) => roleWithin(role, memberRole));
}

/**
 * The role a token acts with: of the roles within both the token's and the member's current role,
 * the one that permits most. An editor's token scoped "reviewer" (or a reviewer's scoped "editor")
 * therefore acts as a viewer: neither role's extra actions are in the other.
 */
export function cappedTokenRole(tokenRole: TeamRole, memberRole: TeamRole): TeamRole {
  let best: TeamRole = "viewer";
  for (const role of teamRoles) {
    if (roleWithin(role, tokenRole) && roleWithin(role, memberRole) && permissionsByRole[role].size > permissionsByRole[best].size) best = role;
  }
  return best;
}
