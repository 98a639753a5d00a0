// The API's answers about verification records: a team's saved results of the verification cases, one
// record with its curves, and the records attached to a run as quality evidence. Dates are ISO strings.
import type { SavedCaseOutcome } from "@/lib/validation/verification";

export interface VerificationRecordSummary {
  id: string;
  teamId: string;
  solverVersion: string;
  /** "<platform> | <user agent>" as the page reported it (lib/verification/saved-record.ts). */
  browser: string;
  kernel: string;
  passedCount: number;
  failedCount: number;
  createdById: string | null;
  /** Null once the person's account is deleted. */
  createdByName: string | null;
  createdAt: string;
}

export interface VerificationRecordDetail extends VerificationRecordSummary {
  outcomes: SavedCaseOutcome[];
}

export interface VerificationRecordsResponse {
  /** Newest first. */
  records: VerificationRecordSummary[];
}

export interface VerificationRecordResponse {
  record: VerificationRecordDetail;
}

/** A case of an attached record as a report prints it: the verdict and every check, without the curves. */
export type EvidenceCaseOutcome = Omit<SavedCaseOutcome, "curves">;

export interface RunEvidenceItem {
  record: VerificationRecordSummary & { outcomes: EvidenceCaseOutcome[] };
  attachedAt: string;
  attachedByName: string | null;
}

export interface RunEvidenceResponse {
  /** Oldest attachment first, the order a report lists them. */
  evidence: RunEvidenceItem[];
}
