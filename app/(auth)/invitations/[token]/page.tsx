import type { Metadata } from "next";
import { InvitationView } from "@/components/invitations/invitation-view";

// The link's secret is in the address: it must not travel on to other pages as a referrer.
export const metadata: Metadata = { title: "Invitation", referrer: "no-referrer" };
export const dynamic = "force-dynamic";

// Open to signed-out visitors: the page says what the link offers and how to sign in to take it.
// The API route checks the link and the caller; the page only shows what it answers.
export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return <InvitationView token={token} />;
}
