// The shapes the API answers with, shared by db/queries (which build them) and the client
// (which reads them). Dates travel as ISO strings.
import type { TeamRole } from "@/lib/access/roles";
import type { ReviewStateName } from "@/lib/review/review-states";
import type { RunSummary } from "@/lib/run-record/summary";
import type { RunSignOff } from "./review-types";

export interface TeamMembershipSummary {
  teamId: string;
  teamName: string;
  teamSlug: string;
  role: TeamRole;
}

export interface MeResponse {
  user: { id: string; name: string; email: string };
  memberships: TeamMembershipSummary[];
  activeTeamId: string | null;
}

export interface StudyListItem {
  id: string;
  title: string;
  description: string;
  siteReference: string;
  createdByName: string | null;
  createdAt: string;
  updatedAt: string;
  sceneCount: number;
  runCount: number;
}

export interface StudyRecord {
  id: string;
  teamId: string;
  title: string;
  description: string;
  siteReference: string;
  createdAt: string;
  updatedAt: string;
}

export interface SceneListItem {
  id: string;
  name: string;
  description: string;
  isReference: boolean;
  version: number;
  data: unknown;
  updatedByName: string | null;
  updatedAt: string;
}

export interface ActivityItem {
  id: string;
  action: string;
  subjectType: string;
  subjectId: string;
  actorName: string | null;
  detail: unknown;
  createdAt: string;
}

export interface TeamMember {
  userId: string;
  name: string;
  email: string;
  role: TeamRole;
}

export interface StudiesResponse {
  studies: StudyListItem[];
}

export interface StudyResponse {
  study: StudyRecord;
  role: TeamRole;
  scenes: SceneListItem[];
  activity: ActivityItem[];
}

export interface SceneRecord {
  id: string;
  studyId: string;
  teamId: string;
  name: string;
  description: string;
  isReference: boolean;
  version: number;
  data: unknown;
  forkedFromSceneId: string | null;
  forkedFromVersion: number | null;
  updatedByName: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface SceneVersionItem {
  version: number;
  authorName: string | null;
  note: string;
  createdAt: string;
}

export interface SceneResponse {
  scene: SceneRecord;
  role: TeamRole;
}

export interface SceneVersionsResponse {
  versions: SceneVersionItem[];
}

/** One saved version's scene JSON, as stored (it may predate the current scene schema). */
export interface SceneVersionDataResponse {
  version: number;
  data: unknown;
}

export type BlockKind = "notes" | "scene" | "run" | "chart";

export interface BlockItem {
  id: string;
  kind: BlockKind;
  position: number;
  content: unknown;
  collapsed: boolean;
  version: number;
  updatedByName: string | null;
  updatedAt: string;
}

export interface BlocksResponse {
  blocks: BlockItem[];
}

// Saved runs (issue #6). The payload itself travels as bytes (lib/run-record/payload.ts); these
// are the JSON answers about it.

export type RunStatusName = "queued" | "running" | "completed" | "failed" | "cancelled";

/** The summary figures a list shows: the run's summary without its per-receiver rows and warning texts. */
export type RunListFigures = Omit<RunSummary, "receivers" | "warnings"> & { warningCount: number };

export interface RunListItem {
  id: string;
  studyId: string;
  /** Null once the scene has been deleted; the run keeps its frozen copy. */
  sceneId: string | null;
  sceneName: string | null;
  sceneVersion: number;
  status: RunStatusName;
  statusMessage: string;
  createdById: string | null;
  createdByName: string | null;
  createdAt: string;
  inputHash: string;
  solverVersion: string;
  /** Size of the stored payload, bytes. */
  resultBytes: number;
  figures: RunListFigures | null;
  /** Where the run stands in review (lib/review/review-states.ts). */
  reviewState: ReviewStateName;
  /** The sign-off in force when reviewState is "signed_off", otherwise null. */
  signOff: RunSignOff | null;
  /** The scene's version now (null once it is deleted), so a sign-off for an older version shows as such. */
  sceneCurrentVersion: number | null;
}

export interface RunRecord extends Omit<RunListItem, "figures"> {
  teamId: string;
  settings: unknown;
  summary: RunSummary | null;
}

export interface RunsResponse {
  runs: RunListItem[];
}

export interface RunResponse {
  run: RunRecord;
  role: TeamRole;
}
