import type { Metadata } from "next";
import type { ReactNode } from "react";
import { SharedFrame } from "@/components/shared-study/shared-frame";
import { findSharedStudyForPage } from "@/lib/server/shared-access";

// A revoked link must stop at once: never render from a cache.
export const dynamic = "force-dynamic";

export const metadata: Metadata = {
  title: "Shared study",
  robots: { index: false, follow: false },
  referrer: "same-origin",
};

export default async function SharedLayout({ children, params }: { children: ReactNode; params: Promise<{ token: string }> }) {
  const access = await findSharedStudyForPage((await params).token);
  return <SharedFrame teamName={access?.heading.teamName ?? null}>{children}</SharedFrame>;
}
