// The access gate for queued jobs and sweeps: a job is as readable as its study. A job of a team the
// caller is not on answers 404 "No such job", like a job that does not exist.
import "server-only";
import { getRunJobById, getSweepById } from "@/db/queries/run-jobs";
import type { TeamAction } from "@/lib/access/roles";
import { AppError } from "@/lib/http/app-error";
import type { RunJobItem } from "@/lib/http/job-types";
import { requireStudyAccess, type Caller } from "@/lib/server/access";

async function requireStudyOf(caller: Caller, studyId: string, action: TeamAction, subject: "job" | "sweep"): Promise<void> {
  try {
    await requireStudyAccess({ caller, studyId, action });
  } catch (error) {
    if (error instanceof AppError && error.kind === "not_found") throw new AppError(`not_found:${subject}`, `No such ${subject}.`);
    if (error instanceof AppError && error.kind === "forbidden") throw new AppError(`forbidden:${subject}`, error.message);
    throw error;
  }
}

export async function requireJobAccess({ caller, jobId, action }: { caller: Caller; jobId: string; action: TeamAction }): Promise<RunJobItem> {
  const job = await getRunJobById({ id: jobId });
  if (!job) throw new AppError("not_found:job", "No such job.");
  await requireStudyOf(caller, job.studyId, action, "job");
  return job;
}

export async function requireSweepAccess({ caller, sweepId, action }: { caller: Caller; sweepId: string; action: TeamAction }): Promise<NonNullable<Awaited<ReturnType<typeof getSweepById>>>> {
  const found = await getSweepById({ id: sweepId });
  if (!found) throw new AppError("not_found:sweep", "No such sweep.");
  await requireStudyOf(caller, found.sweep.studyId, action, "sweep");
  return found;
}
