"use client";
// One saved run, read back from storage: what was run, by whom and how, its figures and warnings,
// the scene as frozen with it, the field replayed from the stored snapshots and maps (nothing is
// recomputed), a repeat that checks the stored traces, and deletion for those allowed.
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useMemo } from "react";
import { RunAccuracySection } from "@/components/accuracy/run-accuracy-section";
import { RunAnalysis } from "@/components/analysis/run-analysis";
import { StudyLiveStrip } from "@/components/live/study-live-strip";
import { RunDiscussionSection } from "@/components/comments/run-discussion";
import { ReviewPanel } from "@/components/review/review-panel";
import { ReviewStateBadge } from "@/components/review/review-state-badge";
import { signOffIsOlder } from "@/components/review/sign-off-facts";
import { RunFactList } from "@/components/runs/run-fact-list";
import { RunStatusBadge } from "@/components/runs/run-status-badge";
import { formatWallTime } from "@/components/runs/run-table-model";
import { formatBytes } from "@/components/scenes/grid-figures";
import { FieldReplay } from "@/components/scenes/run-viewer";
import { QualityEvidence } from "@/components/verification/quality-evidence";
import { RoleBadge } from "@/components/studies/role-badge";
import { Breadcrumb } from "@/components/ui/breadcrumb";
import { Button } from "@/components/ui/button";
import { LoadFailure } from "@/components/ui/load-failure";
import { ErrorState, LoadingRows } from "@/components/ui/states";
import { mayDeleteRun } from "@/lib/access/run-deletion";
import { roleAllows } from "@/lib/access/roles";
import { formatWhen } from "@/lib/client/format";
import { useRun, useSavedRunPayload } from "@/lib/client/run-queries";
import { useStudyLiveUpdates } from "@/lib/client/use-live-updates";
import { parseScene } from "@/lib/fdtd/scene";
import type { RunRecord } from "@/lib/http/api-types";
import type { DecodedRun } from "@/lib/run-record/payload";
import { useDeleteRun } from "./delete-run";
import { FrozenSceneSettings } from "./frozen-scene-settings";
import { RerunCheck } from "./rerun-check";
import { SavedRunFigures } from "./saved-run-figures";

export function SavedRunPage({ studyId, runId, callerId }: { studyId: string; runId: string; callerId: string }) {
  const query = useRun(runId);
  const payload = useSavedRunPayload(query.data ? runId : null);
  // Live: comments, reviews and the record refresh when a colleague acts (the payload is never refetched).
  const live = useStudyLiveUpdates(studyId, { enabled: !query.isError });

  if (query.isPending) return <LoadingRows label="Loading the run" />;
  if (query.isError) return <LoadFailure subject="run" error={query.error} onRetry={() => void query.refetch()} back={{ href: `/studies/${studyId}`, label: "Back to the study" }} />;
  const { run, role } = query.data;

  return (
    <div className="flex flex-col gap-6">
      <SavedRunHeader run={run} role={role} callerId={callerId} />
      <StudyLiveStrip studyId={studyId} live={live} />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="flex min-w-0 flex-col gap-6">
          <section aria-labelledby="field-heading" className="flex flex-col gap-3">
            <h2 id="field-heading" className="text-base font-semibold text-ink">
              Field, replayed from storage
            </h2>
            <div className="rounded-lg border border-rule bg-panel p-3">
              {payload.isPending ? (
                <LoadingRows rows={1} label={`Loading the stored result (${formatBytes(run.resultBytes)})`} />
              ) : payload.isError ? (
                <ErrorState title="The stored result could not be read" message={payload.error.message} onRetry={() => void payload.refetch()} />
              ) : (
                <StoredField saved={payload.data} />
              )}
            </div>
          </section>
          {payload.data ? <RerunCheck saved={payload.data} /> : null}
        </div>
        <aside className="flex flex-col gap-6">
          <ReviewPanel run={run} role={role} callerId={callerId} />
          <QualityEvidence run={run} variant="panel" />
          <section aria-labelledby="figures-heading" className="flex flex-col gap-3">
            <h2 id="figures-heading" className="text-base font-semibold text-ink">
              Grid and figures
            </h2>
            <div className="rounded-lg border border-rule bg-panel p-4">
              {run.summary ? <SavedRunFigures summary={run.summary} /> : <p className="text-sm text-muted">This run has no summary.</p>}
            </div>
          </section>
          <section aria-labelledby="settings-heading" className="flex flex-col gap-3">
            <h2 id="settings-heading" className="text-base font-semibold text-ink">
              Scene and settings as run
            </h2>
            <div className="rounded-lg border border-rule bg-panel p-4">
              {payload.data ? <FrozenSceneOf saved={payload.data} /> : payload.isError ? <p className="text-sm text-muted">Shown once the stored result can be read.</p> : <LoadingRows rows={1} label="Loading the scene as run" />}
            </div>
          </section>
        </aside>
      </div>
      <section aria-labelledby="accuracy-heading" className="flex flex-col gap-3">
        <h2 id="accuracy-heading" className="text-base font-semibold text-ink">
          Accuracy
        </h2>
        {payload.data ? <RunAccuracySection run={payload.data} /> : payload.isError ? <p className="text-sm text-muted">Shown once the stored result can be read.</p> : <LoadingRows rows={1} label="Loading the accuracy estimate" />}
      </section>
      {/* Full width: the band and insertion-loss tables need the room. */}
      <section aria-labelledby="analysis-heading" className="flex flex-col gap-3">
        <h2 id="analysis-heading" className="text-base font-semibold text-ink">
          Analysis
        </h2>
        {payload.data ? (
          <RunAnalysis runId={runId} studyId={studyId} record={run} run={payload.data} canCreate={roleAllows(role, "scene:edit") && roleAllows(role, "run:create")} />
        ) : payload.isError ? (
          <p className="text-sm text-muted">Shown once the stored result can be read.</p>
        ) : (
          <LoadingRows rows={2} label="Loading the traces" />
        )}
      </section>
      <RunDiscussionSection run={run} role={role} callerId={callerId} />
    </div>
  );
}

function SavedRunHeader({ run, role, callerId }: { run: RunRecord; role: Parameters<typeof RoleBadge>[0]["role"]; callerId: string }) {
  const router = useRouter();
  const remove = useDeleteRun({ runId: run.id, studyId: run.studyId });
  const canDelete = mayDeleteRun({ role, callerId, createdById: run.createdById });
  const engine = run.summary?.engine;
  const facts: [string, React.ReactNode][] = [
    ["Run by", `${run.createdByName ?? "a former member"}, ${formatWhen(run.createdAt)}`],
    ["Wall time", run.summary ? formatWallTime(run.summary.wallSeconds) : "–"],
    ["Solver", run.solverVersion],
    ["Threads", engine ? `${engine.threads} (${engine.kernel.split(" ")[0]})` : "–"],
    [
      "Input hash",
      <abbr key="hash" title={run.inputHash} className="font-mono no-underline">
        {run.inputHash.slice(0, 12)}
      </abbr>,
    ],
    ["Stored", formatBytes(run.resultBytes)],
  ];
  return (
    <div>
      <Breadcrumb
        links={[
          { href: "/dashboard", label: "Studies" },
          { href: `/studies/${run.studyId}`, label: "Study" },
        ]}
        current="Saved run"
      />
      <div className="mt-2 flex flex-wrap items-center gap-3">
        <h1 className="text-[26px] font-semibold leading-tight text-ink">
          {run.sceneName ?? "Deleted scene"} <span className="font-normal text-muted">version {run.sceneVersion}</span>
        </h1>
        <RunStatusBadge status={run.status} />
        <ReviewStateBadge state={run.reviewState} older={signOffIsOlder(run)} />
        <RoleBadge role={role} />
        <div className="ml-auto flex items-center gap-2">
          <Link href={`/studies/${run.studyId}/runs/${run.id}/report`} className="text-sm font-medium text-tide-700 hover:underline">
            Printable report
          </Link>
          {run.sceneId ? (
            <Link href={`/studies/${run.studyId}/scenes/${run.sceneId}`} className="text-sm font-medium text-tide-700 hover:underline">
              Open the scene
            </Link>
          ) : null}
          {canDelete ? (
            <Button
              size="sm"
              variant="danger"
              disabled={remove.isPending}
              onClick={() => {
                if (!window.confirm("Delete this saved run? Its stored result is removed for everyone; this cannot be undone.")) return;
                remove.mutate(undefined, { onSuccess: () => router.push(`/studies/${run.studyId}`) });
              }}
            >
              {remove.isPending ? "Deleting…" : "Delete run"}
            </Button>
          ) : null}
        </div>
      </div>
      {run.statusMessage ? <p className="mt-1 text-sm text-ink-soft">{run.statusMessage}</p> : null}
      <RunFactList facts={facts} />
      {remove.isError ? (
        <div className="mt-3">
          <ErrorState title="The run was not deleted" message={remove.error.message} />
        </div>
      ) : null}
    </div>
  );
}

function useFrozenScene(saved: DecodedRun) {
  return useMemo(() => parseScene(saved.header.scene), [saved]);
}

function StoredField({ saved }: { saved: DecodedRun }) {
  const frozen = useFrozenScene(saved);
  if (!frozen.ok) return <ErrorState title="The stored scene does not validate" message={frozen.problems.map((p) => `${p.path}: ${p.message}`).join("; ")} />;
  return <FieldReplay scene={frozen.scene} result={saved} noReferenceReason="Level differences are compared in the analysis below" />;
}

function FrozenSceneOf({ saved }: { saved: DecodedRun }) {
  const frozen = useFrozenScene(saved);
  if (!frozen.ok) return <p className="text-sm text-signal-error">The stored scene does not validate with this version of Rarefact: {frozen.problems[0]?.message}</p>;
  return <FrozenSceneSettings scene={frozen.scene} header={saved.header} />;
}
