import { describe, expect, it } from "vitest";
import { cappedTokenRole, roleWithin, tokenRolesFor } from "@/lib/access/token-scope";
import { roleAllows, teamActions, teamRoles } from "@/lib/access/roles";

describe("an API token's role", () => {
  it("may be given only roles whose every action the member's role has", () => {
    expect(tokenRolesFor("owner")).toEqual(["owner", "editor", "reviewer", "viewer"]);
    expect(tokenRolesFor("editor")).toEqual(["editor", "viewer"]);
    expect(tokenRolesFor("reviewer")).toEqual(["reviewer", "viewer"]);
    expect(tokenRolesFor("viewer")).toEqual(["viewer"]);
    expect(roleWithin("reviewer", "editor")).toBe(false);
  });

  it("acts with the lower of its role and the member's current role", () => {
    expect(cappedTokenRole("owner", "editor")).toBe("editor");
    expect(cappedTokenRole("viewer", "owner")).toBe("viewer");
    expect(cappedTokenRole("editor", "editor")).toBe("editor");
    // Neither role's extra actions are in the other: only reading is left.
    expect(cappedTokenRole("reviewer", "editor")).toBe("viewer");
    expect(cappedTokenRole("editor", "reviewer")).toBe("viewer");
  });

  it("never allows an action that either the token's role or the member's role lacks", () => {
    for (const tokenRole of teamRoles) {
      for (const memberRole of teamRoles) {
        const acting = cappedTokenRole(tokenRole, memberRole);
        for (const action of teamActions) {
          if (roleAllows(acting, action)) expect(roleAllows(tokenRole, action) && roleAllows(memberRole, action), `${tokenRole}/${memberRole}: ${action}`).toBe(true);
        }
      }
    }
  });
});
