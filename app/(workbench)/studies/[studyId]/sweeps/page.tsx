import type { Metadata } from "next";
import { SweepWorkbench } from "@/components/sweeps/sweep-workbench";
import { requirePageCaller } from "@/lib/server/page-session";

export const metadata: Metadata = { title: "Parameter sweep" };

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

const single = (value: string | string[] | undefined) => (typeof value === "string" && value.length <= 64 ? value : undefined);

export default async function SweepsPage({ params, searchParams }: { params: Promise<{ studyId: string }>; searchParams: SearchParams }) {
  const { studyId } = await params;
  const query = await searchParams;
  const scene = single(query.scene);
  const block = single(query.block);
  const sweep = single(query.sweep);
  await requirePageCaller(`/studies/${studyId}/sweeps`);
  return <SweepWorkbench studyId={studyId} {...(scene ? { sceneId: scene } : {})} {...(block ? { fromBlockId: block } : {})} {...(sweep ? { followSweepId: sweep } : {})} />;
}
