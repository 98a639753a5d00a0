import type { ReactNode } from "react";
import { Wordmark } from "@/components/brand/logo";
import { DiffractionIllustration } from "@/components/auth/diffraction-illustration";

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="grid min-h-screen lg:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
      <aside className="relative hidden flex-col justify-between overflow-hidden bg-night p-10 text-white lg:flex">
        <Wordmark tone="light" />
        <DiffractionIllustration className="absolute inset-x-0 top-1/2 -translate-y-1/2 opacity-90" />
        <div className="relative max-w-md">
          <p className="text-2xl font-semibold leading-snug">Wave-based noise prediction for the frequencies where rays fall short.</p>
          <p className="mt-3 text-[15px] text-white/70">
            Set up a 2D section, solve the wave equation in your browser, and review the insertion loss of every design with your team.
          </p>
        </div>
      </aside>
      <main className="flex flex-col items-center justify-center px-6 py-12">
        <div className="mb-10 lg:hidden">
          <Wordmark />
        </div>
        <div className="w-full max-w-sm">{children}</div>
      </main>
    </div>
  );
}
