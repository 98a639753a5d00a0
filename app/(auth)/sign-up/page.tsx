import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignUpForm } from "@/components/auth/sign-up-form";
import { getPageCaller } from "@/lib/server/page-session";

export const metadata: Metadata = { title: "Create an account" };
export const dynamic = "force-dynamic";

/** Only same-site paths may follow sign-up (as on the sign-in page), e.g. back to an invitation. */
function safeNextPath(value: string | string[] | undefined): string {
  const path = Array.isArray(value) ? value[0] : value;
  return path && path.startsWith("/") && !path.startsWith("//") ? path : "/dashboard";
}

export default async function SignUpPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const nextPath = safeNextPath(params.next);
  if (await getPageCaller()) redirect(nextPath);
  const invitedEmail = typeof params.email === "string" ? params.email.slice(0, 254) : "";
  return (
    <div className="flex flex-col gap-8">
      <header>
        <h1 className="text-2xl font-semibold text-ink">Create an account</h1>
        <p className="mt-1 text-[15px] text-muted">You start with a team of your own; colleagues can invite you to theirs.</p>
      </header>
      <SignUpForm nextPath={nextPath} initialEmail={invitedEmail} />
    </div>
  );
}
