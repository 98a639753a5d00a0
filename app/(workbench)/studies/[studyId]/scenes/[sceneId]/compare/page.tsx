import type { Metadata } from "next";
import { SceneComparisonView } from "@/components/forks/scene-comparison-view";

export const metadata: Metadata = { title: "Compare scenes" };

/** A fork beside its origin; `?with=<sceneId>` compares this scene with one of its forks instead. */
export default async function SceneComparePage({ params, searchParams }: { params: Promise<{ studyId: string; sceneId: string }>; searchParams: Promise<{ with?: string | string[] }> }) {
  const { studyId, sceneId } = await params;
  const other = (await searchParams).with;
  return <SceneComparisonView studyId={studyId} sceneId={sceneId} withSceneId={typeof other === "string" ? other : null} />;
}
