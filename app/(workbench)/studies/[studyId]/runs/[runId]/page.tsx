import type { Metadata } from "next";
import { PinBoardProvider } from "@/components/comments/pin-context";
import { SavedRunPage } from "@/components/saved-run/saved-run-page";
import { requirePageCaller } from "@/lib/server/page-session";

export const metadata: Metadata = { title: "Saved run" };

export default async function RunPage({ params }: { params: Promise<{ studyId: string; runId: string }> }) {
  const { studyId, runId } = await params;
  // The caller's id decides whether the delete control shows (the server decides again on DELETE).
  const caller = await requirePageCaller(`/studies/${studyId}/runs/${runId}`);
  // The pin board lets the discussion, the field replay and the trace chart show and pick comment pins.
  return (
    <PinBoardProvider runId={runId}>
      <SavedRunPage studyId={studyId} runId={runId} callerId={caller.userId} />
    </PinBoardProvider>
  );
}
