import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { SharedRunView } from "@/components/shared-study/shared-run-view";
import { getSharedRunById } from "@/db/queries/share-links";
import { findSharedStudyForPage } from "@/lib/server/shared-access";
import { idSchema } from "@/lib/validation/ids";

interface Props {
  params: Promise<{ token: string; runId: string }>;
}

export const metadata: Metadata = { title: "Shared run", robots: { index: false, follow: false } };

// Only a run of the study the link opens: any other id answers the same 404 as an unknown one.
export default async function SharedRunPage({ params }: Props) {
  const { token, runId } = await params;
  const access = await findSharedStudyForPage(token);
  const parsedRunId = idSchema.safeParse(runId);
  if (!access || !parsedRunId.success) notFound();
  const run = await getSharedRunById({ studyId: access.studyId, runId: parsedRunId.data });
  if (!run) notFound();
  return <SharedRunView token={token} studyTitle={access.heading.title} run={run} />;
}
