import type { ReactNode } from "react";
import { AppHeader } from "@/components/shell/app-header";
import { requirePageCaller } from "@/lib/server/page-session";

export const dynamic = "force-dynamic";

export default async function WorkbenchLayout({ children }: { children: ReactNode }) {
  const caller = await requirePageCaller("/dashboard");
  return (
    <div className="flex min-h-screen flex-col">
      {/* On paper only the page's own content prints (the run report carries its own cautions). */}
      <div className="print:hidden">
        <AppHeader userName={caller.name} userEmail={caller.email} />
      </div>
      <main className="mx-auto w-full max-w-6xl flex-1 px-6 py-8 print:max-w-none print:p-0">{children}</main>
      <footer className="border-t border-rule print:hidden">
        <p className="mx-auto max-w-6xl px-6 py-4 text-xs leading-relaxed text-muted">
          Rarefact predicts sound in a 2D section: a coherent line source and infinitely long barriers and buildings. Its results support design
          decisions; they are not a statutory noise assessment. Follow the local regulations and licensed practice where an assessment is required.
        </p>
      </footer>
    </div>
  );
}
