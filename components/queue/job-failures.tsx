// The failed attempts of a job, folded away until asked for: which attempt, on which worker, why, when.
import type { RunJobFailure } from "@/lib/http/job-types";

const timeFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit", second: "2-digit" });

export function JobFailures({ failures }: { failures: readonly RunJobFailure[] }) {
  if (failures.length === 0) return null;
  return (
    <details className="text-[13px]">
      <summary className="cursor-pointer text-signal-error">
        {failures.length === 1 ? "1 failed attempt" : `${failures.length} failed attempts`}
      </summary>
      <ol className="mt-1.5 flex flex-col gap-1 pl-4">
        {failures.map((failure) => (
          <li key={`${failure.attempt}-${failure.at}`} className="text-ink-soft">
            <span className="font-medium text-ink">Attempt {failure.attempt}</span>
            {failure.workerId ? <> on worker <span className="font-mono text-[12px]">{failure.workerId}</span></> : null}, {timeFormat.format(new Date(failure.at))}: {failure.message}
          </li>
        ))}
      </ol>
    </details>
  );
}
