// better-auth's endpoints (sign-up, sign-in, sign-out, session, teams). The auth module is
// imported lazily so that `next build` does not open the database while collecting routes.
//
// Of the organization plugin's endpoints only switching the active team and reading one's teams
// stay open: inviting, accepting, changing roles, removing, creating and deleting teams go through
// Rarefact's own routes (app/api/teams/**, app/api/invitations/**), which keep an owner on every
// team, make links single-use and record the activity. Everything else under /organization/ is 404.
const openTeamEndpoints = new Set(["/api/auth/organization/set-active", "/api/auth/organization/list", "/api/auth/organization/get-active-member", "/api/auth/organization/get-active-member-role"]);

/** Compared after decoding, folding case and collapsing slashes, so no spelling of a path slips past. */
function isClosedTeamEndpoint(request: Request): boolean {
  let path = new URL(request.url).pathname;
  try {
    path = decodeURIComponent(path);
  } catch {
    return true;
  }
  path = path.toLowerCase().replace(/\/+/g, "/").replace(/\/$/, "");
  if (!/\/organization(\/|$)/.test(path)) return false;
  return !openTeamEndpoints.has(path);
}

async function handle(request: Request): Promise<Response> {
  if (isClosedTeamEndpoint(request)) {
    return Response.json({ error: { code: "not_found:endpoint", message: "Manage teams and invitations on the team page." } }, { status: 404 });
  }
  const { getAuth } = await import("@/lib/server/auth");
  const auth = await getAuth();
  return auth.handler(request);
}

export const GET = handle;
export const POST = handle;
