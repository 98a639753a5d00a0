// A band's rating as a small badge: green reliable, amber use with care, grey not resolved.
import type { BandRating } from "@/lib/analysis/accuracy";

const style: Record<BandRating, string> = {
  reliable: "border-signal-ok/40 bg-signal-ok/10 text-signal-ok",
  "use with care": "border-signal-warn/50 bg-signal-warn/10 text-signal-warn",
  "not resolved": "border-rule-strong bg-ink/5 text-muted",
};

export function RatingBadge({ rating }: { rating: BandRating }) {
  return <span className={`inline-block whitespace-nowrap rounded border px-1.5 py-px font-sans text-[11px] font-medium ${style[rating]}`}>{rating}</span>;
}
