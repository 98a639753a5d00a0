// Seeds the invented demo (people and study in demo-accounts.ts, scenes in scenes/): a reference
// section and two barrier designs. Seeded on first start; running it again changes nothing.
import "server-only";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import { getAuth, skipPersonalTeamFor } from "@/lib/server/auth";
import { createBlock, listBlocksByStudyId } from "../queries/blocks";
import { listScenesByStudyId, createScene } from "../queries/scenes";
import { createStudy, listStudiesByTeamId } from "../queries/studies";
import { addMembership, createTeam, getMembershipRole, getTeamBySlug } from "../queries/teams";
import { getUserIdByEmail } from "../queries/users";
import { demoMembers, demoPassword, demoStudy, demoTeam } from "./demo-accounts";
import designA from "./scenes/design-a-3m-reflective.json";
import designB from "./scenes/design-b-4m-absorptive.json";
import reference from "./scenes/reference-no-barrier.json";

const demoNotes = {
  brief: [
    "## The question",
    "",
    "Residents of **Alder Row** (invented) report traffic noise from the near lane of Fernhill Road, about 40 m away. The council asks whether a barrier on the raised verge would bring the gardens and the first-floor windows down by a worthwhile margin.",
    "",
    "- Source: tyre noise of the near lane, modelled as a line source 0.5 m above the verge.",
    "- Receivers: the middle of the gardens at 1.5 m, and the ground- and first-floor windows 1 m from the façade.",
    "- Frequencies: up to 400 Hz, where the barrier's benefit is smallest and ray methods least reliable.",
  ].join("\n"),
  plan: [
    "## Plan",
    "",
    "1. Run the reference and both designs; compare insertion loss per octave band at each receiver.",
    "2. Check the 4 m design's absorptive face against reflections back towards the houses across the road.",
    "3. Ask Priya to review the runs before the figures go into the report.",
    "",
    "_A 2D section assumes an infinitely long road and barrier: treat the figures as design guidance, not an assessment._",
  ].join("\n"),
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
  const notebookWasEmpty = (await listBlocksByStudyId({ studyId })).length === 0;
  if (notebookWasEmpty) {
    await createBlock({ studyId, authorId: engineerId, kind: "notes", content: { markdown: demoNotes.brief }, afterBlockId: null });
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
  if (notebookWasEmpty) {
    await listBlocksByStudyId({ studyId });
    await createBlock({ studyId, authorId: engineerId, kind: "notes", content: { markdown: demoNotes.plan }, afterBlockId: null });
    added = true;
  }
  return added;
}

export function demoCredentialsText(): string {
  const lines = demoMembers.map((m) => `    ${m.email.padEnd(22)} ${m.role.padEnd(9)} ${m.name}, ${m.job}`);
  return [`  Demo team "${demoTeam.name}", password for everyone: ${demoPassword}`, ...lines].join("\n");
}

export { demoMembers, demoPassword, demoStudy, demoTeam };
