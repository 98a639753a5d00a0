// The seeded demo as notebook and run tests start from it: every demo member signed in (one cookie
// per role) and the id of the owner's first study. Import "./test-database" before this in the test.
import * as meRoute from "@/app/api/me/route";
import * as teamStudiesRoute from "@/app/api/teams/[teamId]/studies/route";
import { demoMembers, demoPassword } from "@/db/seed/demo-accounts";
import { prepareDatabase } from "@/db/startup";
import type { TeamRole } from "@/lib/access/roles";
import { callRoute, signInAs } from "./api";

export async function openDemoStudy(): Promise<{ cookies: Map<TeamRole, string>; studyId: string }> {
  await prepareDatabase({ seed: true });
  const cookies = new Map<TeamRole, string>();
  for (const member of demoMembers) cookies.set(member.role, await signInAs(member.email, demoPassword));
  const me = await callRoute(meRoute.GET, { path: "/api/me", cookie: cookies.get("owner") });
  const teamId = ((await me.json()) as { activeTeamId: string }).activeTeamId;
  const list = await callRoute(teamStudiesRoute.GET, { path: `/api/teams/${teamId}/studies`, params: { teamId }, cookie: cookies.get("owner") });
  const studyId = ((await list.json()) as { studies: { id: string }[] }).studies[0]!.id;
  return { cookies, studyId };
}
