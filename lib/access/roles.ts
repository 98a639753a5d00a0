// Team roles and what each may do. Roles are data: the server's access check and the UI's
// enabled/hidden controls both read this one table, so they cannot disagree.

export const teamRoles = ["owner", "editor", "reviewer", "viewer"] as const;
export type TeamRole = (typeof teamRoles)[number];

export const teamActions = [
  "team:read",
  "team:manage-members",
  "study:read",
  "study:create",
  "study:edit",
  "study:delete",
  "scene:edit",
  "run:create",
  "run:comment",
  "run:request-review",
  "run:review",
  "comment:moderate",
  "study:share",
  "team:read-mail",
  "verification:record",
  "run:attach-evidence",
] as const;
export type TeamAction = (typeof teamActions)[number];

const readOnly: TeamAction[] = ["team:read", "study:read"];

/**
 * role -> permitted actions. Reviewers comment and sign off but never edit what they review.
 * Authors edit and delete their own comments whatever their role; "comment:moderate" lets owners
 * remove anyone's. Forking needs study:read on the origin and scene:edit where the fork goes.
 * Saving verification results and attaching them to a run as quality evidence is for those who edit
 * or review runs; viewers only read them.
 */
export const permissionsByRole: Record<TeamRole, ReadonlySet<TeamAction>> = {
  owner: new Set<TeamAction>(teamActions),
  editor: new Set<TeamAction>([...readOnly, "study:create", "study:edit", "scene:edit", "run:create", "run:comment", "run:request-review", "verification:record", "run:attach-evidence"]),
  reviewer: new Set<TeamAction>([...readOnly, "run:comment", "run:review", "verification:record", "run:attach-evidence"]),
  viewer: new Set<TeamAction>(readOnly),
};

export const roleDescriptions: Record<TeamRole, string> = {
  owner: "Manages members, shares studies by link, reads the team's mailbox, and can do everything an editor or reviewer can.",
  editor: "Creates studies, edits scenes and runs simulations.",
  reviewer: "Reads everything, comments on runs and signs them off; cannot edit scenes.",
  viewer: "Reads studies, scenes and runs.",
};

export function isTeamRole(value: unknown): value is TeamRole {
  return typeof value === "string" && (teamRoles as readonly string[]).includes(value);
}

export function roleAllows(role: TeamRole, action: TeamAction): boolean {
  return permissionsByRole[role].has(action);
}
