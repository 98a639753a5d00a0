// The activity feed and presence as the API answers them (study feed, team feed, who has a study open).

/** One entry of a feed: an activity with what a reader needs to name it and link to it. */
export interface FeedItem {
  id: string;
  teamId: string;
  studyId: string | null;
  /** Null for team-wide entries (members, invitations). */
  studyTitle: string | null;
  actorId: string | null;
  actorName: string | null;
  action: string;
  subjectType: string;
  subjectId: string;
  detail: Record<string, unknown>;
  /** The run the entry concerns (a saved run itself, or the run a comment or review is on). */
  runId: string | null;
  /** The run's study, scene name and version, when the run still exists (it is then linked). */
  runLabel: { studyId: string; sceneName: string | null; sceneVersion: number } | null;
  /** The scene's current name, when the subject is a scene that still exists. */
  sceneName: string | null;
  createdAt: string;
}

export interface FeedPage {
  items: FeedItem[];
  /** Pass as `before` to read the next, older page; null when there is none. */
  nextBefore: string | null;
}

/** One person with a study open (one entry however many tabs they have). */
export interface PresentUser {
  userId: string;
  name: string;
  initials: string;
  /** When their earliest open connection began. */
  since: string;
}

export interface PresenceResponse {
  present: PresentUser[];
}

/** What an `activity` server-sent event carries: the live event and, when it could be read, the feed entry. */
export interface ActivityStreamMessage {
  id: string;
  teamId: string;
  studyId: string | null;
  actorId: string | null;
  action: string;
  subjectType: string;
  subjectId: string;
  runId: string | null;
  at: string;
  item: FeedItem | null;
}

export interface PresenceStreamMessage {
  studyId: string;
  at: string;
}
