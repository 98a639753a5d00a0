"use client";
// The verification page: Rarefact's verification cases (the list `npm test` runs), run on demand in
// this browser's workers one at a time, with their curves and checks; the results saved for the team
// with the solver version and browser; and the team's saved results, each openable without running.
import { useSearchParams } from "next/navigation";
import { useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { roleAllows } from "@/lib/access/roles";
import { useMe } from "@/lib/client/queries";
import { useSaveVerificationRecord } from "@/lib/client/verification-queries";
import { SOLVER_VERSION } from "@/lib/run-record/solver-version";
import { idSchema } from "@/lib/validation/ids";
import { describeBrowser, savedCaseOutcome } from "@/lib/verification/saved-record";
import { CaseCard } from "./case-card";
import { formatSeconds } from "./case-result";
import { pageVerificationCases } from "./model/case-list";
import { SavedRecordList, SavedRecordView } from "./saved-records";
import { useVerificationRunner, type CaseRunState } from "./use-verification-runner";

/** The platform as the page can read it: the client hint where the browser gives one, else navigator.platform. */
function reportedPlatform(): string {
  const hinted = (navigator as Navigator & { userAgentData?: { platform?: string } }).userAgentData?.platform;
  return hinted || navigator.platform || "";
}

type Done = Extract<CaseRunState, { status: "done" }>;

function SaveResults({ teamId, done }: { teamId: string; done: { id: string; title: string; state: Done }[] }) {
  const save = useSaveVerificationRecord(teamId);
  const [savedCount, setSavedCount] = useState<number | null>(null);
  const onSave = () => {
    const kernels = [...new Set(done.map((entry) => entry.state.kernel))].join(", ");
    save.mutate(
      {
        solverVersion: SOLVER_VERSION,
        browser: describeBrowser(reportedPlatform(), navigator.userAgent),
        kernel: kernels,
        outcomes: done.map((entry) => savedCaseOutcome({ id: entry.id, title: entry.title }, entry.state.outcome)),
      },
      { onSuccess: () => setSavedCount(done.length) },
    );
  };
  return (
    <div className="flex flex-col gap-1">
      <Button variant="secondary" onClick={onSave} disabled={done.length === 0 || save.isPending}>
        {save.isPending ? "Saving…" : "Save these results"}
      </Button>
      {save.isError ? <p className="text-[13px] text-signal-error">Not saved: {save.error.message}</p> : null}
      {save.isSuccess && savedCount !== null ? (
        <p className="text-[13px] text-tide-700" role="status">
          Saved {savedCount} case{savedCount === 1 ? "" : "s"} for the team.
        </p>
      ) : null}
    </div>
  );
}

export function VerificationPage() {
  const me = useMe();
  const searchParams = useSearchParams();
  const requested = searchParams.get("record");
  const openId = requested && idSchema.safeParse(requested).success ? requested : null;
  const runner = useVerificationRunner();
  const teamId = me.data?.activeTeamId ?? null;
  const role = me.data?.memberships.find((membership) => membership.teamId === teamId)?.role ?? null;

  const { stateOf } = runner;
  const done = useMemo(
    () =>
      pageVerificationCases.flatMap((verificationCase) => {
        const state = stateOf(verificationCase.id);
        return state.status === "done" ? [{ id: verificationCase.id, title: verificationCase.title, state }] : [];
      }),
    [stateOf],
  );
  const running = pageVerificationCases.find((verificationCase) => stateOf(verificationCase.id).status === "running");
  const passed = done.filter((entry) => entry.state.outcome.pass).length;
  const totalSeconds = done.reduce((sum, entry) => sum + entry.state.outcome.seconds, 0);

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-col gap-2">
        <p className="text-[12px] font-medium tracking-wide text-tide-700 uppercase">Verification</p>
        <h1 className="text-[26px] leading-tight font-semibold text-ink">How the solver compares with published solutions</h1>
        <p className="max-w-3xl text-[15px] leading-relaxed text-ink-soft">
          Each case runs Rarefact&apos;s solver on a scene whose answer is known exactly and compares the two, figure by figure, against a stated tolerance. These are the same cases the automated tests run before every release. Run them here, in
          this browser&apos;s workers, to see the result on your own machine; save the results to keep them with your team and attach them to a run&apos;s report.
        </p>
        <p className="max-w-3xl rounded-md border border-ember-500/30 bg-ember-50 px-3 py-2 text-[13px] leading-relaxed text-ink-soft">
          Passing cases show that the solver solves the 2D wave equation as intended at the resolutions stated. They do not show that a particular scene is fine enough for the frequencies it reports, and a 2D prediction is not a statutory noise
          assessment.
        </p>
      </div>

      {openId && teamId ? (
        <SavedRecordView teamId={teamId} recordId={openId} />
      ) : (
        <>
          <div className="sticky top-0 z-10 flex flex-wrap items-start gap-3 rounded-lg border border-rule bg-panel/95 px-4 py-3 shadow-sm backdrop-blur">
            <Button onClick={() => runner.run(pageVerificationCases.map((c) => c.id))} disabled={runner.busy}>
              Run all
            </Button>
            {runner.busy ? (
              <Button variant="danger" onClick={runner.cancel}>
                Cancel
              </Button>
            ) : null}
            <p className="self-center text-sm text-ink-soft" aria-live="polite">
              {done.length === 0 ? `${pageVerificationCases.length} cases; none run yet.` : `${done.length} of ${pageVerificationCases.length} cases run: ${passed} passed, ${done.length - passed} failed, ${formatSeconds(totalSeconds)} in all.`}
              {running ? ` Running: ${running.title}.` : ""}
            </p>
            <div className="ml-auto">
              {teamId && role && roleAllows(role, "verification:record") ? (
                runner.busy ? (
                  <p className="self-center text-[13px] text-muted">Save once the cases have finished.</p>
                ) : (
                  <SaveResults teamId={teamId} done={done} />
                )
              ) : me.data ? (
                <p className="text-[13px] text-muted">Your role does not save results.</p>
              ) : null}
            </div>
          </div>
          {pageVerificationCases.map((verificationCase) => (
            <CaseCard key={verificationCase.id} verificationCase={verificationCase} state={runner.stateOf(verificationCase.id)} onRun={() => runner.run([verificationCase.id])} runDisabled={false} />
          ))}
        </>
      )}

      <section aria-labelledby="saved-results-heading" className="flex flex-col gap-3">
        <h2 id="saved-results-heading" className="text-base font-semibold text-ink">
          The team&apos;s saved results
        </h2>
        {me.isPending ? <LoadingRows rows={1} label="Loading your team" /> : me.isError ? <ErrorState title="Your team could not be loaded" message={me.error.message} /> : teamId ? <SavedRecordList teamId={teamId} openId={openId} /> : <p className="text-sm text-muted">Join a team to keep results.</p>}
      </section>
    </div>
  );
}
