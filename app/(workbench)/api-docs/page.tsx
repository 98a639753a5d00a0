import type { Metadata } from "next";
import Link from "next/link";
import { ApiReference } from "@/components/api-docs/api-reference";
import { Breadcrumb } from "@/components/ui/breadcrumb";

export const metadata: Metadata = { title: "API reference" };

export default function ApiDocsPage() {
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-col gap-2">
        <Breadcrumb links={[{ href: "/dashboard", label: "Studies" }]} current="API reference" />
        <h1 className="text-[28px] font-semibold leading-tight text-ink">API reference</h1>
        <p className="max-w-3xl text-sm leading-relaxed text-ink-soft">
          Every endpoint of Rarefact’s HTTP API, generated from the same schemas the server checks requests with. Scripts send a personal token as{" "}
          <code className="font-mono text-[13px]">Authorization: Bearer rft_…</code> (make one under{" "}
          <Link href="/settings/tokens" className="font-medium text-tide-700 underline underline-offset-2">
            API tokens
          </Link>
          ); the machine-readable document is{" "}
          <a href="/api/openapi.json" className="font-mono text-[13px] text-tide-700 underline underline-offset-2">
            /api/openapi.json
          </a>
          . “Try” sends real requests as you: they change your studies like the pages do.
        </p>
      </div>
      <ApiReference />
    </div>
  );
}
