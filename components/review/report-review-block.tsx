// The review as a printed report states it: signed off by whom, when, for which run hash and scene
// version (and whether the scene has moved on since), or plainly "Not signed off".
import type { RunRecord } from "@/lib/http/api-types";
import { reviewStateLabels } from "@/lib/review/review-states";
import { SignOffStandingNotice } from "./sign-off-facts";

const when = (iso: string) => new Date(iso).toLocaleString("en-GB", { dateStyle: "long", timeStyle: "short" });

type ReviewedRecord = Pick<RunRecord, "reviewState" | "signOff" | "sceneCurrentVersion">;

export function ReportReviewBlock({ run }: { run: ReviewedRecord }) {
  const signOff = run.reviewState === "signed_off" ? run.signOff : null;
  if (!signOff) {
    return (
      <div data-testid="report-review" className="flex flex-col gap-1 rounded-md border border-rule-strong px-3 py-2 break-inside-avoid">
        <p className="text-sm font-semibold text-ink print:text-[10pt]">Not signed off</p>
        <p className="text-[13px] text-ink-soft print:text-[9pt]">
          Review state: {reviewStateLabels[run.reviewState]}. Nobody has signed off these results; treat them as unchecked.
        </p>
      </div>
    );
  }
  return (
    <div data-testid="report-review" className="flex flex-col gap-2 rounded-md border border-signal-ok/30 px-3 py-2 break-inside-avoid">
      <p className="text-sm text-ink print:text-[10pt]">
        <span className="font-semibold text-signal-ok">Signed off</span> by {signOff.signedOffByName ?? "a former member"} on {when(signOff.signedOffAt)}, for the run with input hash{" "}
        <code className="break-all font-mono text-[12px] print:text-[8pt]">{signOff.runInputHash}</code>, made from version {signOff.sceneVersion} of the scene.
      </p>
      {signOff.note ? <p className="text-[13px] whitespace-pre-wrap text-ink-soft print:text-[9pt]">Reviewer&apos;s note: {signOff.note}</p> : null}
      <SignOffStandingNotice run={run} />
    </div>
  );
}

/** The one sentence under the report's title. */
export function reportReviewSentence(run: ReviewedRecord): string {
  if (run.reviewState !== "signed_off" || !run.signOff) return "Not signed off.";
  return `Signed off by ${run.signOff.signedOffByName ?? "a former member"}, ${when(run.signOff.signedOffAt)}.`;
}
