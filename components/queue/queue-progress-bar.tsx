// The bar of a server run or sweep, with its percent and the time left in words beside it.
import { percentOf } from "./model/queue-progress";
import { timeLeftWords } from "./model/queue-words";

export function QueueProgressBar({ label, fraction, completed, secondsLeft, showTimeLeft }: { label: string; fraction: number; completed: boolean; secondsLeft: number | null; showTimeLeft: boolean }) {
  const percent = percentOf(fraction, completed);
  return (
    <div className="flex items-center gap-3">
      <div role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={percent} className="h-1.5 flex-1 overflow-hidden rounded-full bg-rule">
        <div className={`h-full rounded-full transition-[width] ${completed ? "bg-signal-ok" : "bg-tide-500"}`} style={{ width: `${percent}%` }} />
      </div>
      <span className="tabular w-10 text-right font-mono text-[12px] text-ink">{percent}%</span>
      {showTimeLeft ? <span className="min-w-36 text-[12px] text-muted">{timeLeftWords(secondsLeft)}</span> : null}
    </div>
  );
}
