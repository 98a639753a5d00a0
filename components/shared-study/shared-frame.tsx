// The frame of a page opened by a read-only link, outside the signed-in workbench: the brand, who shared
// the study, the way in for team members, and the caution every prediction carries.
import Link from "next/link";
import type { ReactNode } from "react";
import { Wordmark } from "@/components/brand/logo";

export function SharedFrame({ teamName, children }: { teamName: string | null; children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-rule bg-panel print:hidden">
        <div className="mx-auto flex max-w-6xl items-center justify-between gap-4 px-6 py-3">
          <Wordmark />
          <Link href="/sign-in" className="text-sm font-medium text-tide-700 hover:underline">
            Sign in
          </Link>
        </div>
      </header>
      {teamName ? (
        <div role="note" data-testid="shared-banner" className="border-b border-tide-100 bg-tide-50">
          <p className="mx-auto max-w-6xl px-6 py-2 text-sm text-ink-soft">
            Read-only view shared by <span className="font-medium text-ink">{teamName}</span>;{" "}
            <Link href="/sign-in" className="font-medium text-tide-700 underline underline-offset-2 hover:text-tide-600">
              sign in
            </Link>{" "}
            for the full workbench.
          </p>
        </div>
      ) : null}
      <main className="mx-auto w-full max-w-6xl flex-1 px-6 py-8">{children}</main>
      <footer className="border-t border-rule">
        <p className="mx-auto max-w-6xl px-6 py-4 text-xs leading-relaxed text-muted">
          These results are 2D predictions: a section through a coherent line source and infinitely long barriers and buildings. They support design decisions; a 2D
          prediction is not a statutory noise assessment. Follow the local regulations and licensed practice where an assessment is required.
        </p>
      </footer>
    </div>
  );
}
