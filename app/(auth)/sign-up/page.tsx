import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignUpForm } from "@/components/auth/sign-up-form";
import { getPageCaller } from "@/lib/server/page-session";

export const metadata: Metadata = { title: "Create an account" };
export const dynamic = "force-dynamic";

export default async function SignUpPage() {
  if (await getPageCaller()) redirect("/dashboard");
  return (
    <div className="flex flex-col gap-8">
      <header>
        <h1 className="text-2xl font-semibold text-ink">Create an account</h1>
        <p className="mt-1 text-[15px] text-muted">You start with a team of your own; colleagues can invite you to theirs.</p>
      </header>
      <SignUpForm />
    </div>
  );
}
