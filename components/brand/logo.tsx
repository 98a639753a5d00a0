/** Rarefact's mark: a line source with three wavefronts, the outer one breaking over an edge. */
export function LogoMark({ className = "size-7" }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden>
      <rect width="32" height="32" rx="7" fill="#127673" />
      <circle cx="8" cy="24" r="2.6" fill="#fadccd" />
      <path d="M8 17.5a6.5 6.5 0 0 1 6.5 6.5" fill="none" stroke="#ffffff" strokeWidth="2.2" strokeLinecap="round" />
      <path d="M8 11.5a12.5 12.5 0 0 1 12.5 12.5" fill="none" stroke="#ffffff" strokeWidth="2.2" strokeLinecap="round" opacity="0.8" />
      <path d="M8 5.5a18.5 18.5 0 0 1 14.2 6.6" fill="none" stroke="#ffffff" strokeWidth="2.2" strokeLinecap="round" opacity="0.6" />
      <path d="M24 13v13" stroke="#d65a2c" strokeWidth="2.4" strokeLinecap="round" />
    </svg>
  );
}

export function Wordmark({ tone = "dark" }: { tone?: "dark" | "light" }) {
  return (
    <span className="flex items-center gap-2.5">
      <LogoMark />
      <span className={`text-[17px] font-semibold tracking-[0.01em] ${tone === "light" ? "text-white" : "text-ink"}`}>rarefact</span>
    </span>
  );
}
