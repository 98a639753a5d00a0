import type { Metadata } from "next";
import { RunReport } from "@/components/report/run-report";
import { requirePageCaller } from "@/lib/server/page-session";

export const metadata: Metadata = { title: "Run report" };

export default async function RunReportPage({ params }: { params: Promise<{ studyId: string; runId: string }> }) {
  const { studyId, runId } = await params;
  await requirePageCaller(`/studies/${studyId}/runs/${runId}/report`);
  // The reference run (?reference=<runId>) is read in the client, where its selector changes it.
  return <RunReport studyId={studyId} runId={runId} />;
}
