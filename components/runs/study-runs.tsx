"use client";
// The study's "Runs" section: its saved runs in a table, with loading, empty and error states.
import { EmptyState, ErrorState, LoadingRows } from "@/components/ui/states";
import { useStudyRuns } from "@/lib/client/run-queries";
import { RunTable } from "./run-table";

export function StudyRuns({ studyId }: { studyId: string }) {
  const query = useStudyRuns(studyId);
  return (
    <section aria-labelledby="runs-heading" className="flex flex-col gap-4">
      <h2 id="runs-heading" className="text-lg font-semibold text-ink">
        Runs
      </h2>
      {query.isPending ? (
        <LoadingRows rows={2} label="Loading the saved runs" />
      ) : query.isError ? (
        <ErrorState title="The saved runs could not be loaded" message={query.error.message} onRetry={() => void query.refetch()} />
      ) : query.data.runs.length === 0 ? (
        <EmptyState title="No saved runs yet">Run a scene in the browser and save it: every saved run of this study is listed here with its grid, time and figures.</EmptyState>
      ) : (
        <RunTable runs={query.data.runs} studyId={studyId} />
      )}
    </section>
  );
}
