// A study opened by its read-only link, without signing in: its heading, notebook, scenes and saved runs
// with their summaries and review states. Nothing of any other study, and nothing that writes.
import { getSharedStudyContent } from "@/db/queries/share-links";
import { requireSharedStudy, sharedRoute } from "@/lib/server/shared-access";

interface Context {
  params: Promise<{ token: string }>;
}

export const GET = sharedRoute<Context>(async (_request, { params }) => {
  const access = await requireSharedStudy((await params).token);
  return Response.json(await getSharedStudyContent({ access }));
});
