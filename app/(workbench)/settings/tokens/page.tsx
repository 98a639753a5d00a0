import type { Metadata } from "next";
import { ApiTokensPage } from "@/components/api-tokens/api-tokens-page";

export const metadata: Metadata = { title: "API tokens" };

// The workbench layout has checked the session already.
export default function ApiTokensSettingsPage() {
  return <ApiTokensPage />;
}
