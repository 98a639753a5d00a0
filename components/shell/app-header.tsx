"use client";
import Link from "next/link";
import { usePathname } from "next/navigation";
import { Wordmark } from "@/components/brand/logo";
import { TeamNavLink } from "@/components/team/team-nav-link";
import { TeamSwitcher } from "./team-switcher";

function initials(name: string): string {
  return name
    .split(/\s+/)
    .filter(Boolean)
    .slice(0, 2)
    .map((part) => part[0]!.toUpperCase())
    .join("");
}

/** Each link is current on the paths it names (a study's pages belong to "Studies"). */
const navigation = [
  { href: "/dashboard", label: "Studies", paths: ["/dashboard", "/studies"] },
  { href: "/verification", label: "Verification", paths: ["/verification"] },
];

export function AppHeader({ userName, userEmail }: { userName: string; userEmail: string }) {
  const pathname = usePathname();
  return (
    <header className="bg-night text-white">
      <div className="mx-auto flex h-14 max-w-6xl items-center gap-8 px-6">
        <Link href="/dashboard" aria-label="Rarefact, studies">
          <Wordmark tone="light" />
        </Link>
        <nav aria-label="Main" className="flex items-center gap-1 text-sm">
          {navigation.map((item) => {
            const active = item.paths.some((path) => pathname === path || pathname.startsWith(`${path}/`));
            return (
              <Link
                key={item.href}
                href={item.href}
                aria-current={active ? "page" : undefined}
                className={`rounded-md px-3 py-1.5 font-medium transition-colors ${active ? "bg-white/12 text-white" : "text-white/70 hover:text-white"}`}
              >
                {item.label}
              </Link>
            );
          })}
          <TeamNavLink />
          <Link
            href="/api-docs"
            aria-current={pathname.startsWith("/api-docs") ? "page" : undefined}
            className={`rounded-md px-3 py-1.5 font-medium transition-colors ${pathname.startsWith("/api-docs") ? "bg-white/12 text-white" : "text-white/70 hover:text-white"}`}
          >
            API
          </Link>
        </nav>
        <div className="ml-auto flex items-center gap-4">
          <TeamSwitcher />
          <div className="flex items-center gap-2.5">
            <span aria-hidden className="inline-flex size-8 items-center justify-center rounded-full bg-tide-500 text-xs font-semibold">
              {initials(userName)}
            </span>
            <div className="hidden text-right leading-tight sm:block">
              <p className="text-sm font-medium" data-testid="signed-in-user">
                {userName}
              </p>
              <p className="text-xs text-white/60">{userEmail}</p>
            </div>
          </div>
          <Link
            href="/settings/tokens"
            aria-current={pathname.startsWith("/settings/tokens") ? "page" : undefined}
            className="rounded-md px-2.5 py-1.5 text-sm text-white/70 hover:bg-white/10 hover:text-white"
          >
            API tokens
          </Link>
          <Link href="/sign-out" className="rounded-md px-2.5 py-1.5 text-sm text-white/70 hover:bg-white/10 hover:text-white">
            Sign out
          </Link>
        </div>
      </div>
    </header>
  );
}
