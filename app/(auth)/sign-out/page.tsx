import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignOutPanel } from "@/components/auth/sign-out-panel";
import { getPageCaller } from "@/lib/server/page-session";

export const metadata: Metadata = { title: "Sign out" };
export const dynamic = "force-dynamic";

export default async function SignOutPage() {
  const caller = await getPageCaller();
  if (!caller) redirect("/sign-in");
  return (
    <div className="flex flex-col gap-8">
      <header>
        <h1 className="text-2xl font-semibold text-ink">Sign out</h1>
      </header>
      <SignOutPanel name={caller.name} />
    </div>
  );
}
