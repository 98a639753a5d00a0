"use client";
// One verification case on the page: what it checks, the published solution and its source, the scene
// and resolution it runs, a Run button with progress, then its result.
import { useMemo } from "react";
import { SceneFigure } from "@/components/report/scene-figure";
import { Button } from "@/components/ui/button";
import { ErrorState } from "@/components/ui/states";
import type { VerificationCase } from "@/lib/verification/cases";
import { VerdictBadge } from "./check-table";
import { CaseResult, formatSeconds } from "./case-result";
import { caseSceneFacts } from "./model/case-list";
import type { CaseRunState } from "./use-verification-runner";

function Progress({ state }: { state: Extract<CaseRunState, { status: "running" }> }) {
  const percent = Math.round(state.progress.fraction * 100);
  return (
    <div className="flex flex-col gap-1">
      <div role="progressbar" aria-label="Progress of the case" aria-valuemin={0} aria-valuemax={100} aria-valuenow={percent} className="h-2 w-full overflow-hidden rounded-full bg-tide-50 ring-1 ring-tide-100">
        <div className="h-full rounded-full bg-tide-500 transition-[width]" style={{ width: `${percent}%` }} />
      </div>
      <p className="text-[13px] text-muted" aria-live="polite">
        {percent}% · {state.progress.stage}
      </p>
    </div>
  );
}

export function CaseCard({ verificationCase, state, onRun, runDisabled }: { verificationCase: VerificationCase; state: CaseRunState; onRun: () => void; runDisabled: boolean }) {
  const facts = useMemo(() => caseSceneFacts(verificationCase), [verificationCase]);
  const headingId = `case-${verificationCase.id}`;
  const active = state.status === "running" || state.status === "queued";
  return (
    <section aria-labelledby={headingId} className="flex flex-col gap-4 rounded-lg border border-rule bg-panel p-5" data-testid={`verification-case-${verificationCase.id}`}>
      <div className="flex flex-wrap items-start gap-3">
        <h2 id={headingId} className="text-lg font-semibold text-ink">
          {verificationCase.title}
        </h2>
        {state.status === "done" ? <VerdictBadge pass={state.outcome.pass} /> : null}
        <div className="ml-auto flex items-center gap-2">
          {state.status === "queued" ? <span className="text-[13px] text-muted">Waiting for the case before it</span> : null}
          <Button size="sm" variant={state.status === "done" ? "secondary" : "primary"} onClick={onRun} disabled={runDisabled || active} aria-label={`Run ${verificationCase.title}`}>
            {state.status === "done" || state.status === "failed" || state.status === "cancelled" ? "Run again" : "Run"}
          </Button>
        </div>
      </div>
      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_17rem]">
        <div className="flex flex-col gap-3 text-sm leading-relaxed text-ink-soft">
          <div>
            <h3 className="text-[13px] font-semibold tracking-wide text-muted uppercase">What is checked</h3>
            <p>{verificationCase.whatIsChecked}</p>
          </div>
          <div>
            <h3 className="text-[13px] font-semibold tracking-wide text-muted uppercase">Published solution</h3>
            <p>{verificationCase.reference.name}</p>
            <p className="text-[13px] text-muted">Source: {verificationCase.reference.source}</p>
          </div>
          <div>
            <h3 className="text-[13px] font-semibold tracking-wide text-muted uppercase">Resolution</h3>
            <p>{verificationCase.resolution}</p>
          </div>
        </div>
        <div className="flex flex-col gap-2">
          <h3 className="text-[13px] font-semibold tracking-wide text-muted uppercase">Scene</h3>
          {facts ? (
            <>
              <div className="rounded-md border border-rule bg-white p-1" aria-label={`Sketch of the scene of ${verificationCase.title}`} role="group">
                <SceneFigure scene={facts.scene} cellSize={facts.grid.cellSize} />
              </div>
              <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-[12px]">
                {facts.rows.map(([label, value]) => (
                  <div key={label} className="contents">
                    <dt className="text-muted">{label}</dt>
                    <dd className="text-ink">{value}</dd>
                  </div>
                ))}
              </dl>
            </>
          ) : (
            <p className="text-[13px] text-muted">No simulation: the case analyses a synthesised signal whose answer is known exactly.</p>
          )}
        </div>
      </div>
      {state.status === "running" ? <Progress state={state} /> : null}
      {state.status === "cancelled" ? <p className="text-[13px] text-muted">Cancelled before it finished.</p> : null}
      {state.status === "failed" ? <ErrorState title="The case did not finish" message={`${state.message} (after ${formatSeconds(state.wallSeconds)})`} /> : null}
      {state.status === "done" ? (
        <CaseResult title={verificationCase.title} checks={state.outcome.checks} curves={state.outcome.curves} seconds={state.outcome.seconds} timing={`in this browser (${formatSeconds(state.wallSeconds)} with the worker's start), kernel ${state.kernel}`} />
      ) : null}
    </section>
  );
}
