import { describe, expect, it } from "vitest";
import { decideAccess } from "@/lib/access/decide";
import { teamActions, teamRoles, type TeamAction, type TeamRole } from "@/lib/access/roles";

// The product's role matrix, written out by hand so that a change to lib/access/roles.ts that
// breaks it fails here. "y" = allowed, "-" = forbidden.
//                         owner editor reviewer viewer
const expected: Record<TeamAction, string> = {
  "team:read":            "y     y      y        y",
  "team:manage-members":  "y     -      -        -",
  "study:read":           "y     y      y        y",
  "study:create":         "y     y      -        -",
  "study:edit":           "y     y      -        -",
  "study:delete":         "y     -      -        -",
  "scene:edit":           "y     y      -        -",
  "run:create":           "y     y      -        -",
  "run:comment":          "y     y      y        -",
  "run:request-review":   "y     y      -        -",
  "run:review":           "y     -      y        -",
  "comment:moderate":     "y     -      -        -",
  "study:share":          "y     -      -        -",
  "team:read-mail":       "y     -      -        -",
  "verification:record":  "y     y      y        -",
  "run:attach-evidence":  "y     y      y        -",
};

function expectedFor(role: TeamRole, action: TeamAction): "allow" | "forbidden" {
  const column = teamRoles.indexOf(role);
  return expected[action].split(/\s+/)[column] === "y" ? "allow" : "forbidden";
}

describe("the role x action matrix", () => {
  for (const role of teamRoles) {
    for (const action of teamActions) {
      it(`${role} ${expectedFor(role, action) === "allow" ? "may" : "may not"} ${action}`, () => {
        expect(decideAccess({ signedIn: true, role, action })).toBe(expectedFor(role, action));
      });
    }
  }

  it("a reviewer cannot edit a scene", () => {
    expect(decideAccess({ signedIn: true, role: "reviewer", action: "scene:edit" })).toBe("forbidden");
  });

  it("a caller without a session is unauthenticated whatever the action", () => {
    for (const action of teamActions) expect(decideAccess({ signedIn: false, role: "owner", action })).toBe("unauthenticated");
  });

  it("someone outside the team is told the thing does not exist", () => {
    for (const action of teamActions) expect(decideAccess({ signedIn: true, role: null, action })).toBe("not_found");
  });
});
