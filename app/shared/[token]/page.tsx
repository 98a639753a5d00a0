import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { SharedStudyView } from "@/components/shared-study/shared-study-view";
import { getSharedStudyContent } from "@/db/queries/share-links";
import { findSharedStudyForPage } from "@/lib/server/shared-access";

interface Props {
  params: Promise<{ token: string }>;
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const access = await findSharedStudyForPage((await params).token);
  return { title: access ? access.heading.title : "Link not found", robots: { index: false, follow: false } };
}

// The link is the only credential: a working one shows the study read-only, anything else a plain 404.
export default async function SharedStudyPage({ params }: Props) {
  const { token } = await params;
  const access = await findSharedStudyForPage(token);
  if (!access) notFound();
  return <SharedStudyView token={token} content={await getSharedStudyContent({ access })} />;
}
