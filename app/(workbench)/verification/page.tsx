import type { Metadata } from "next";
import { VerificationPage } from "@/components/verification/verification-page";
import { requirePageCaller } from "@/lib/server/page-session";

export const metadata: Metadata = { title: "Verification" };

export default async function VerificationRoute() {
  await requirePageCaller("/verification");
  // The saved record opened (?record=<id>) is read in the client, where the list's links change it.
  return <VerificationPage />;
}
