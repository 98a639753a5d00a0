"use client";
// The team's saved verification records (date, who, solver version, browser, verdicts), each openable,
// and one opened record: its cases' saved curves and checks, shown without running anything.
import Link from "next/link";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { useVerificationRecord, useVerificationRecords } from "@/lib/client/verification-queries";
import type { VerificationRecordSummary } from "@/lib/http/verification-types";
import { SOLVER_VERSION } from "@/lib/run-record/solver-version";
import { browserLabel } from "@/lib/verification/saved-record";
import { VerdictBadge } from "./check-table";
import { CaseResult, formatSeconds } from "./case-result";

const when = (iso: string) => new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" });

export function RecordVerdict({ record }: { record: Pick<VerificationRecordSummary, "passedCount" | "failedCount"> }) {
  const total = record.passedCount + record.failedCount;
  return (
    <span className="inline-flex items-center gap-1.5">
      <VerdictBadge pass={record.failedCount === 0 && total > 0} size="xs" />
      <span>
        {record.passedCount} of {total} passed
      </span>
    </span>
  );
}

export function SavedRecordList({ teamId, openId }: { teamId: string; openId: string | null }) {
  const records = useVerificationRecords(teamId);
  if (records.isPending) return <LoadingRows rows={1} label="Loading the saved results" />;
  if (records.isError) return <ErrorState title="The saved results could not be listed" message={records.error.message} onRetry={() => void records.refetch()} />;
  if (records.data.records.length === 0) return <p className="text-sm text-muted">No results saved yet. Run the cases above and save them to keep them with the team.</p>;
  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-panel">
      <table className="w-full border-collapse text-[13px]">
        <caption className="sr-only">The team&apos;s saved verification results, newest first</caption>
        <thead>
          <tr className="text-left text-muted">
            {["Saved", "By", "Solver version", "Browser", "Kernel", "Cases", ""].map((label, k) => (
              <th key={k} scope="col" className="border-b border-rule-strong px-3 py-1.5 font-medium">
                {label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {records.data.records.map((record) => (
            <tr key={record.id} className={record.id === openId ? "bg-tide-50" : undefined}>
              <td className="border-b border-rule px-3 py-1.5 whitespace-nowrap">{when(record.createdAt)}</td>
              <td className="border-b border-rule px-3 py-1.5">{record.createdByName ?? "a former member"}</td>
              <td className="border-b border-rule px-3 py-1.5">
                <span className="font-mono text-[12px]">{record.solverVersion}</span>
                {record.solverVersion !== SOLVER_VERSION ? <span className="ml-1.5 text-[12px] text-signal-warn">(not this build&apos;s)</span> : null}
              </td>
              <td className="border-b border-rule px-3 py-1.5" title={record.browser}>
                {browserLabel(record.browser)}
              </td>
              <td className="border-b border-rule px-3 py-1.5 font-mono text-[12px]">{record.kernel}</td>
              <td className="border-b border-rule px-3 py-1.5 whitespace-nowrap">
                <RecordVerdict record={record} />
              </td>
              <td className="border-b border-rule px-3 py-1.5 text-right">
                <Link href={`/verification?record=${record.id}`} className="font-medium text-tide-700 hover:underline" aria-label={`Open the results saved ${when(record.createdAt)}`}>
                  Open
                </Link>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function SavedRecordView({ teamId, recordId }: { teamId: string; recordId: string }) {
  const query = useVerificationRecord(teamId, recordId);
  if (query.isPending) return <LoadingRows rows={2} label="Loading the saved results" />;
  if (query.isError) return <ErrorState title="The saved results could not be opened" message={query.error.message} onRetry={() => void query.refetch()} />;
  const record = query.data.record;
  const total = record.outcomes.reduce((sum, outcome) => sum + outcome.seconds, 0);
  return (
    <div className="flex flex-col gap-5" data-testid="saved-verification-record">
      <div className="flex flex-col gap-2 rounded-lg border border-rule bg-panel p-5">
        <div className="flex flex-wrap items-center gap-3">
          <h2 className="text-lg font-semibold text-ink">Saved results of {when(record.createdAt)}</h2>
          <RecordVerdict record={record} />
          <Link href="/verification" className="ml-auto text-sm font-medium text-tide-700 hover:underline">
            Back to the cases
          </Link>
        </div>
        <dl className="grid grid-cols-[minmax(8rem,auto)_1fr] gap-x-4 gap-y-1 text-sm">
          {(
            [
              ["Saved by", record.createdByName ?? "a former member"],
              ["Solver version", record.solverVersion === SOLVER_VERSION ? `${record.solverVersion} (this build's)` : `${record.solverVersion} (this build runs ${SOLVER_VERSION})`],
              ["Browser", `${browserLabel(record.browser)} — ${record.browser}`],
              ["Kernel", record.kernel],
              ["Time of the cases", formatSeconds(total)],
            ] as const
          ).map(([label, value]) => (
            <div key={label} className="contents">
              <dt className="text-muted">{label}</dt>
              <dd className="break-words text-ink">{value}</dd>
            </div>
          ))}
        </dl>
        <p className="text-[13px] text-muted">Shown as saved: curves thinned to at most 400 points per series, figures to six significant digits. Nothing is run again.</p>
      </div>
      {record.outcomes.map((outcome) => (
        <section key={outcome.caseId} aria-labelledby={`saved-${outcome.caseId}`} className="flex flex-col gap-3 rounded-lg border border-rule bg-panel p-5">
          <h3 id={`saved-${outcome.caseId}`} className="text-base font-semibold text-ink">
            {outcome.title}
          </h3>
          <CaseResult title={outcome.title} checks={outcome.checks} curves={outcome.curves} seconds={outcome.seconds} />
        </section>
      ))}
    </div>
  );
}
