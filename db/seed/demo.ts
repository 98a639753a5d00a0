// The invented demo: a small consultancy, its members, and a roadside barrier study with a
// reference section and two designs. Seeded on first start; running it again changes nothing.
import "server-only";
import type { TeamRole } from "@/lib/access/roles";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import { getAuth, skipPersonalTeamFor } from "@/lib/server/auth";
import { listScenesByStudyId, createScene } from "../queries/scenes";
import { createStudy, listStudiesByTeamId } from "../queries/studies";
import { addMembership, createTeam, getMembershipRole, getTeamBySlug } from "../queries/teams";
import { getUserIdByEmail } from "../queries/users";
import designA from "./scenes/design-a-3m-reflective.json";
import designB from "./scenes/design-b-4m-absorptive.json";
import reference from "./scenes/reference-no-barrier.json";

export const demoPassword = "fernhill-demo-2026";
export const demoTeam = { slug: "fernhill-acoustics-demo", name: "Fernhill Acoustics (demo)" };

export const demoMembers: { name: string; email: string; role: TeamRole; job: string }[] = [
  { name: "Ines Okafor", email: "ines@fernhill.test", role: "owner", job: "engineer who runs the study" },
  { name: "Tomas Lindgren", email: "tomas@fernhill.test", role: "editor", job: "colleague who tries variants" },
  { name: "Priya Raman", email: "priya@fernhill.test", role: "reviewer", job: "reviewer who signs off runs" },
  { name: "Owen Marsh", email: "owen@fernhill.test", role: "viewer", job: "client's planner, read-only" },
];

export const demoStudy = {
  title: "Alder Row: roadside noise barrier",
  siteReference: "FH-2026-014",
  description:
    "Cross-section from the near lane of Fernhill Road to the west façades of Alder Row. Does a 3 m reflective timber barrier do enough for the garden and the first-floor windows, or is the 4 m absorptive design worth its cost? Invented demo data.",
};

const demoScenes = [
  { data: reference, isReference: true, description: "Existing situation: raised verge, lawn, façade; no barrier. Insertion loss is measured against this." },
  { data: designA, isReference: false, description: "Timber barrier 3.0 m above the verge at the kerb line, reflective on both faces." },
  { data: designB, isReference: false, description: "Steel-cassette barrier 4.0 m above the verge, absorptive on the road face." },
];

async function ensureUser(member: (typeof demoMembers)[number]): Promise<string> {
  const existing = await getUserIdByEmail({ email: member.email });
  if (existing) return existing;
  skipPersonalTeamFor(member.email);
  const auth = await getAuth();
  const result = await auth.api.signUpEmail({ body: { name: member.name, email: member.email, password: demoPassword } });
  return result.user.id;
}

/** Seeds the demo team, members and study where they are missing. Returns whether anything was added. */
export async function seedDemo(): Promise<boolean> {
  let added = false;
  const userIds = new Map<string, string>();
  for (const member of demoMembers) {
    const before = await getUserIdByEmail({ email: member.email });
    userIds.set(member.email, await ensureUser(member));
    added ||= before === null;
  }

  let team = await getTeamBySlug({ slug: demoTeam.slug });
  if (!team) {
    const created = await createTeam({ name: demoTeam.name, slug: demoTeam.slug });
    team = { id: created.id, name: demoTeam.name };
    added = true;
  }
  for (const member of demoMembers) {
    const userId = userIds.get(member.email)!;
    if (!(await getMembershipRole({ teamId: team.id, userId }))) {
      await addMembership({ teamId: team.id, userId, role: member.role });
      added = true;
    }
  }

  const engineerId = userIds.get(demoMembers[0]!.email)!;
  const studies = await listStudiesByTeamId({ teamId: team.id });
  let studyId = studies.find((s) => s.title === demoStudy.title)?.id;
  if (!studyId) {
    studyId = (await createStudy({ teamId: team.id, createdBy: engineerId, input: demoStudy })).id;
    added = true;
  }
  const existingScenes = await listScenesByStudyId({ studyId });
  for (const [position, demo] of demoScenes.entries()) {
    const data = parseSceneOrThrow(demo.data);
    if (existingScenes.some((s) => s.name === data.name)) continue;
    await createScene({
      teamId: team.id,
      studyId,
      authorId: engineerId,
      name: data.name,
      description: demo.description,
      isReference: demo.isReference,
      data,
      position,
    });
    added = true;
  }
  return added;
}

export function demoCredentialsText(): string {
  const lines = demoMembers.map((m) => `    ${m.email.padEnd(22)} ${m.role.padEnd(9)} ${m.name}, ${m.job}`);
  return [`  Demo team "${demoTeam.name}", password for everyone: ${demoPassword}`, ...lines].join("\n");
}
