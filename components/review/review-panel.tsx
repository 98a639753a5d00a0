"use client";
// The saved run's review panel: where the run stands, the sign-off in force (and whether it belongs
// to an older scene version), the commands this person may give, and the history of decisions.
import type { TeamRole } from "@/lib/access/roles";
import type { RunRecord } from "@/lib/http/api-types";
import { reviewStateMeanings } from "@/lib/review/review-states";
import { ReviewActions } from "./review-actions";
import { ReviewHistory } from "./review-history";
import { ReviewStateBadge } from "./review-state-badge";
import { SignOffFacts, SignOffStandingNotice, signOffIsOlder } from "./sign-off-facts";

export function ReviewPanel({ run, role, callerId }: { run: RunRecord; role: TeamRole; callerId: string }) {
  return (
    <section aria-labelledby="review-heading" className="flex flex-col gap-3">
      <h2 id="review-heading" className="text-base font-semibold text-ink">
        Review
      </h2>
      <div data-testid="review-panel" className="flex flex-col gap-4 rounded-lg border border-rule bg-panel p-4">
        <div className="flex flex-col gap-1.5">
          <div>
            <ReviewStateBadge state={run.reviewState} older={signOffIsOlder(run)} />
          </div>
          <p className="text-[13px] text-muted">{reviewStateMeanings[run.reviewState]}</p>
        </div>
        {run.reviewState === "signed_off" && run.signOff ? (
          <div className="flex flex-col gap-2">
            <SignOffFacts signOff={run.signOff} />
            <SignOffStandingNotice run={run} />
          </div>
        ) : null}
        {run.status === "completed" ? (
          <ReviewActions run={run} role={role} callerId={callerId} />
        ) : (
          <p className="text-[13px] text-muted">Only a completed run can be reviewed; this one is {run.status}.</p>
        )}
        <div className="flex flex-col gap-2 border-t border-rule pt-3">
          <h3 className="text-sm font-medium text-ink-soft">History</h3>
          <ReviewHistory runId={run.id} />
        </div>
      </div>
    </section>
  );
}
