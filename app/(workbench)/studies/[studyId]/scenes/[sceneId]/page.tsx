import type { Metadata } from "next";
import { SceneWorkspace } from "@/components/scenes/scene-workspace";

export const metadata: Metadata = { title: "Scene" };

export default async function ScenePage({ params }: { params: Promise<{ studyId: string; sceneId: string }> }) {
  const { studyId, sceneId } = await params;
  return <SceneWorkspace studyId={studyId} sceneId={sceneId} />;
}
