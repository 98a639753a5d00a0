// The sign-off in force on a run (who, when, for which run hash and scene version) and, when the
// scene has been saved since, the notice that the sign-off belongs to the older version.
import type { RunRecord } from "@/lib/http/api-types";
import type { RunSignOff } from "@/lib/http/review-types";
import { shortHash, signOffStanding, signOffStandingNotice } from "@/lib/review/sign-off-standing";

const when = (iso: string) => new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" });

export function SignOffFacts({ signOff }: { signOff: RunSignOff }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
      <dt className="text-muted">Signed off by</dt>
      <dd className="text-ink">{signOff.signedOffByName ?? "a former member"}</dd>
      <dt className="text-muted">On</dt>
      <dd className="text-ink">
        <time dateTime={signOff.signedOffAt}>{when(signOff.signedOffAt)}</time>
      </dd>
      <dt className="text-muted">Run hash</dt>
      <dd className="font-mono text-[13px] text-ink">
        <abbr title={signOff.runInputHash} className="no-underline">
          {shortHash(signOff.runInputHash)}
        </abbr>
      </dd>
      <dt className="text-muted">Scene version</dt>
      <dd className="text-ink">{signOff.sceneVersion}</dd>
    </dl>
  );
}

/** The stale-version notice, or nothing when the sign-off is for the scene as it is now. */
export function SignOffStandingNotice({ run, className = "" }: { run: Pick<RunRecord, "signOff" | "sceneCurrentVersion">; className?: string }) {
  if (!run.signOff) return null;
  const notice = signOffStandingNotice(signOffStanding({ signedVersion: run.signOff.sceneVersion, sceneCurrentVersion: run.sceneCurrentVersion }));
  if (!notice) return null;
  return (
    <p role="note" data-testid="sign-off-older-version" className={`rounded-md border border-signal-warn/30 bg-[#fdf6e7] px-3 py-2 text-[13px] leading-snug text-ink-soft ${className}`}>
      <span className="font-medium text-signal-warn">Older version: </span>
      {notice}
    </p>
  );
}

/** Whether a signed-off run's sign-off belongs to an older scene version (for the badge). */
export function signOffIsOlder(run: Pick<RunRecord, "signOff" | "sceneCurrentVersion">): boolean {
  if (!run.signOff) return false;
  return signOffStanding({ signedVersion: run.signOff.sceneVersion, sceneCurrentVersion: run.sceneCurrentVersion }).kind !== "current";
}
