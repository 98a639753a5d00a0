"use client";
// The study page's feed: everything done in the study and on its runs.
import { useStudyActivity } from "@/lib/client/activity-queries";
import { ActivityFeed } from "./activity-feed";

export function StudyActivityPanel({ studyId, viewerId }: { studyId: string; viewerId: string | null }) {
  const query = useStudyActivity(studyId);
  return <ActivityFeed query={query} viewerId={viewerId} />;
}
