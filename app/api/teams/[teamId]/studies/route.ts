// A team's studies: list them (any member) and create one (owners and editors).
import { createStudy, listStudiesByTeamId } from "@/db/queries/studies";
import { requireCaller, requireTeamAccess } from "@/lib/server/access";
import { apiRoute, parseJsonBody, parseWith } from "@/lib/server/route";
import { idSchema } from "@/lib/validation/ids";
import { studyInputSchema } from "@/lib/validation/study";

interface Context {
  params: Promise<{ teamId: string }>;
}

export const GET = apiRoute<Context>(async (request, { params }) => {
  const teamId = parseWith(idSchema, (await params).teamId, "team");
  const caller = await requireCaller(request.headers);
  await requireTeamAccess({ caller, teamId, action: "study:read" });
  return Response.json({ studies: await listStudiesByTeamId({ teamId }) });
});

export const POST = apiRoute<Context>(async (request, { params }) => {
  const teamId = parseWith(idSchema, (await params).teamId, "team");
  const caller = await requireCaller(request.headers);
  await requireTeamAccess({ caller, teamId, action: "study:create" });
  const input = await parseJsonBody(request, studyInputSchema, "study");
  const study = await createStudy({ teamId, createdBy: caller.userId, input });
  return Response.json({ study }, { status: 201 });
});
