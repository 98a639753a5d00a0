"use client";
// A run's quality evidence: the team's saved verification results attached to it, with each case's
// verdict and its decisive check, a warning where the results come from another solver version, and
// (for those who may) attaching and detaching. The report prints it; the saved run page shows it compact.
import Link from "next/link";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { roleAllows } from "@/lib/access/roles";
import { useRun } from "@/lib/client/run-queries";
import { useAttachEvidence, useDetachEvidence, useRunEvidence, useVerificationRecords } from "@/lib/client/verification-queries";
import type { RunRecord } from "@/lib/http/api-types";
import type { RunEvidenceItem } from "@/lib/http/verification-types";
import { browserLabel } from "@/lib/verification/saved-record";
import { VerdictBadge, formatError } from "./check-table";
import { decisiveCheck, solverMismatch } from "./model/evidence";
import { RecordVerdict } from "./saved-records";

type Variant = "report" | "panel";

const when = (iso: string) => new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" });
const numberHead = "border-b border-rule-strong px-2 py-1 text-right font-medium text-muted whitespace-nowrap";
const head = "border-b border-rule-strong px-2 py-1 text-left font-medium text-muted";
const cell = "border-b border-rule px-2 py-1 align-top text-ink";
const numberCell = "border-b border-rule px-2 py-1 text-right align-top font-mono tabular whitespace-nowrap text-ink";

function AttachControl({ run, attached }: { run: RunRecord; attached: Set<string> }) {
  const records = useVerificationRecords(run.teamId);
  const attach = useAttachEvidence(run.id);
  const [choice, setChoice] = useState("");
  if (records.isPending) return <p className="text-[13px] text-muted">Loading the team&apos;s saved results…</p>;
  if (records.isError) return <p className="text-[13px] text-signal-error">The team&apos;s saved results could not be listed: {records.error.message}</p>;
  const candidates = records.data.records.filter((record) => !attached.has(record.id));
  if (candidates.length === 0)
    return (
      <p className="text-[13px] text-muted">
        {records.data.records.length === 0 ? "The team has no saved verification results yet. " : "Every saved result of the team is attached. "}
        <Link href="/verification" className="font-medium text-tide-700 hover:underline">
          Run and save the cases
        </Link>
      </p>
    );
  const selectId = `evidence-choice-${run.id}`;
  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={selectId} className="text-[13px] font-medium text-ink-soft">
        Attach saved verification results
      </label>
      <div className="flex flex-wrap items-center gap-2">
        <select id={selectId} value={choice} onChange={(event) => setChoice(event.target.value)} className="h-8 max-w-full min-w-0 flex-1 rounded-md border border-rule-strong bg-panel px-2 text-[13px] text-ink focus:border-tide-500 focus:ring-2 focus:ring-tide-500/20 focus:outline-none">
          <option value="">Choose saved results…</option>
          {candidates.map((record) => (
            <option key={record.id} value={record.id}>
              {when(record.createdAt)} · {record.passedCount} of {record.passedCount + record.failedCount} passed · {browserLabel(record.browser)}
              {record.solverVersion === run.solverVersion ? "" : " · other solver version"}
            </option>
          ))}
        </select>
        <Button size="sm" disabled={!choice || attach.isPending} onClick={() => attach.mutate(choice, { onSuccess: () => setChoice("") })}>
          {attach.isPending ? "Attaching…" : "Attach"}
        </Button>
      </div>
      {attach.isError ? <p className="text-[13px] text-signal-error">Not attached: {attach.error.message}</p> : null}
    </div>
  );
}

function EvidenceRecord({ item, run, variant, canChange }: { item: RunEvidenceItem; run: RunRecord; variant: Variant; canChange: boolean }) {
  const detach = useDetachEvidence(run.id);
  const { record } = item;
  const mismatch = solverMismatch(record.solverVersion, run.solverVersion);
  const heading = (
    <div className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
      <span className="font-medium text-ink">Saved {when(record.createdAt)}</span>
      <RecordVerdict record={record} />
      <Link href={`/verification?record=${record.id}`} className="text-[13px] font-medium text-tide-700 hover:underline print:hidden">
        Open
      </Link>
      {canChange ? (
        <Button size="sm" variant="quiet" className="ml-auto print:hidden" disabled={detach.isPending} onClick={() => detach.mutate(record.id)} aria-label={`Detach the results saved ${when(record.createdAt)}`}>
          {detach.isPending ? "Detaching…" : "Detach"}
        </Button>
      ) : null}
    </div>
  );
  const facts: [string, string][] = [
    ["Saved by", `${record.createdByName ?? "a former member"}; attached by ${item.attachedByName ?? "a former member"}, ${when(item.attachedAt)}`],
    ["Solver version", mismatch ? `${record.solverVersion} (this run: ${run.solverVersion})` : `${record.solverVersion}, the run's own`],
    ["Browser", `${browserLabel(record.browser)}; kernel ${record.kernel}`],
  ];
  return (
    <div className="flex flex-col gap-2 rounded-md border border-rule bg-white px-3 py-2.5 break-inside-avoid" data-testid="quality-evidence-record">
      {heading}
      <dl className={`grid gap-x-3 gap-y-0.5 ${variant === "report" ? "grid-cols-[minmax(8rem,auto)_1fr] text-sm print:text-[9pt]" : "grid-cols-[auto_1fr] text-[12px]"}`}>
        {facts.map(([label, value]) => (
          <div key={label} className="contents">
            <dt className="text-muted">{label}</dt>
            <dd className="break-words text-ink">{value}</dd>
          </div>
        ))}
      </dl>
      {mismatch ? (
        <p role="note" className="rounded-md border border-signal-warn/30 bg-[#fdf6e7] px-2.5 py-1.5 text-[13px] text-ink-soft print:text-[9pt]">
          <span className="font-medium text-signal-warn">Check: </span>
          {mismatch}
        </p>
      ) : null}
      {variant === "report" ? (
        <div className="overflow-x-auto">
          <table className="w-full border-collapse text-[13px] print:text-[8.5pt] [&_tr]:break-inside-avoid">
            <caption className="sr-only">Cases of the verification results saved {when(record.createdAt)}</caption>
            <thead>
              <tr>
                <th scope="col" className={head}>
                  Case
                </th>
                <th scope="col" className={head}>
                  Verdict
                </th>
                <th scope="col" className={numberHead}>
                  Checks passed
                </th>
                <th scope="col" className={head}>
                  Decisive check
                </th>
                <th scope="col" className={numberHead}>
                  Error
                </th>
                <th scope="col" className={numberHead}>
                  Tolerance
                </th>
              </tr>
            </thead>
            <tbody>
              {record.outcomes.map((outcome) => {
                const decisive = decisiveCheck(outcome.checks);
                return (
                  <tr key={outcome.caseId}>
                    <th scope="row" className={`${cell} text-left font-normal`}>
                      {outcome.title}
                    </th>
                    <td className={cell}>
                      <VerdictBadge pass={outcome.pass} size="xs" />
                    </td>
                    <td className={numberCell}>
                      {outcome.checks.filter((check) => check.pass).length} of {outcome.checks.length}
                    </td>
                    <td className={`${cell} text-[12px] text-ink-soft print:text-[8pt]`}>{decisive?.label ?? "no checks"}</td>
                    <td className={numberCell}>{decisive ? formatError(decisive.error, decisive.errorUnit, decisive.tolerance) : "–"}</td>
                    <td className={numberCell}>{decisive ? (decisive.tolerance === 0 && decisive.errorUnit !== "relative" ? `≤ 0 ${decisive.errorUnit} (a ceiling)` : `± ${formatError(decisive.tolerance, decisive.errorUnit)}`) : "–"}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      ) : (
        <ul className="flex flex-col gap-0.5 text-[12px]">
          {record.outcomes.map((outcome) => (
            <li key={outcome.caseId} className="flex items-start gap-1.5">
              <VerdictBadge pass={outcome.pass} size="xs" />
              <span className="text-ink-soft">{outcome.title}</span>
            </li>
          ))}
        </ul>
      )}
      {detach.isError ? <p className="text-[13px] text-signal-error">Not detached: {detach.error.message}</p> : null}
    </div>
  );
}

export function QualityEvidence({ run, variant }: { run: RunRecord; variant: Variant }) {
  const access = useRun(run.id);
  const evidence = useRunEvidence(run.id);
  const canChange = access.data ? roleAllows(access.data.role, "run:attach-evidence") : false;
  const headingId = `quality-evidence-${variant}`;
  const items = evidence.data?.evidence ?? [];
  const report = variant === "report";
  return (
    <section aria-labelledby={headingId} className={report ? "flex flex-col gap-3 border-t border-rule pt-5 print:pt-3" : "flex flex-col gap-3"}>
      <h2 id={headingId} className={report ? "text-base font-semibold text-ink break-after-avoid print:text-[13pt]" : "text-base font-semibold text-ink"}>
        Quality evidence
      </h2>
      <div className={report ? "flex flex-col gap-3" : "flex flex-col gap-3 rounded-lg border border-rule bg-panel p-4"}>
        <p className={report ? "text-sm text-ink-soft print:text-[9.5pt]" : "text-[13px] text-ink-soft"}>
          Saved results of Rarefact&apos;s verification cases, which compare the solver with published exact solutions (
          <Link href="/verification" className="font-medium text-tide-700 hover:underline">
            verification page
          </Link>
          <span className="hidden print:inline">: /verification</span>). They show how the solver performed in the browser named; whether this scene&apos;s grid resolves its frequencies is a separate question.
        </p>
        {evidence.isPending ? (
          <LoadingRows rows={1} label="Loading the quality evidence" />
        ) : evidence.isError ? (
          <ErrorState title="The quality evidence could not be loaded" message={evidence.error.message} onRetry={() => void evidence.refetch()} />
        ) : items.length === 0 ? (
          <p className="text-sm text-muted">No verification results are attached to this run.</p>
        ) : (
          items.map((item) => <EvidenceRecord key={item.record.id} item={item} run={run} variant={variant} canChange={canChange} />)
        )}
        {canChange && evidence.data ? (
          <div className="print:hidden">
            <AttachControl run={run} attached={new Set(items.map((item) => item.record.id))} />
          </div>
        ) : null}
      </div>
    </section>
  );
}
