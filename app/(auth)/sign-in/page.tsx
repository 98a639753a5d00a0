import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/auth/sign-in-form";
import { demoMembers, demoPassword } from "@/db/seed/demo-accounts";
import { getPageCaller } from "@/lib/server/page-session";

export const metadata: Metadata = { title: "Sign in" };
export const dynamic = "force-dynamic";

/** Only same-site paths may follow sign-in, so a crafted link cannot send people elsewhere. */
function safeNextPath(value: string | string[] | undefined): string {
  const path = Array.isArray(value) ? value[0] : value;
  return path && path.startsWith("/") && !path.startsWith("//") ? path : "/dashboard";
}

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  if (await getPageCaller()) redirect(safeNextPath(params.next));
  const showDemo = process.env.RAREFACT_SEED_DEMO !== "false";
  return (
    <div className="flex flex-col gap-8">
      <header>
        <h1 className="text-2xl font-semibold text-ink">Sign in</h1>
        <p className="mt-1 text-[15px] text-muted">{params.signedOut ? "You have signed out. See you soon." : "Welcome back to your team's studies."}</p>
      </header>
      <SignInForm nextPath={safeNextPath(params.next)} />
      {showDemo ? (
        <section aria-label="Demo accounts" className="rounded-lg border border-rule bg-panel p-4 text-sm">
          <h2 className="font-semibold text-ink">Demo accounts</h2>
          <p className="mt-1 text-muted">
            Password for all: <code className="font-mono text-ink">{demoPassword}</code>
          </p>
          <ul className="mt-2 divide-y divide-rule">
            {demoMembers.map((member) => (
              <li key={member.email} className="flex justify-between gap-3 py-1.5">
                <code className="font-mono text-[13px] text-ink">{member.email}</code>
                <span className="text-muted">{member.role}</span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
