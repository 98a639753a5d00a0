// The answers of the team routes (members, invitations, kept e-mail). Dates travel as ISO strings.
import type { TeamRole } from "@/lib/access/roles";
import type { InvitationState } from "@/lib/collaboration/membership-rules";

/** A member as the team page shows them. `userId` is the member's id in /members/[memberId]. */
export interface TeamMemberDetail {
  userId: string;
  membershipId: string;
  name: string;
  email: string;
  role: TeamRole;
  joinedAt: string;
}

export interface TeamMembersResponse {
  team: { id: string; name: string };
  members: TeamMemberDetail[];
}

export interface TeamMemberResponse {
  member: TeamMemberDetail;
}

export interface TeamInvitationItem {
  id: string;
  email: string;
  role: TeamRole;
  /** "expired" is a pending invitation past its expiry. */
  state: InvitationState;
  inviterName: string | null;
  createdAt: string;
  expiresAt: string;
  acceptedAt: string | null;
  acceptedByName: string | null;
}

export interface TeamInvitationsResponse {
  invitations: TeamInvitationItem[];
}

/** After an invitation is made: the record, and whether its e-mail went out, was kept, or failed. */
export interface CreatedInvitationResponse {
  invitation: TeamInvitationItem;
  mail: { status: "kept" | "sent" | "failed"; error?: string };
}

/** What the invitation page shows about a link (never the token or the invitation's id). */
export interface InvitationDescription {
  teamId: string;
  teamName: string;
  inviterName: string | null;
  email: string;
  role: TeamRole;
  expiresAt: string;
  /** Null when nobody is signed in. */
  signedInEmail: string | null;
  emailMatches: boolean;
  /** The signed-in caller is on the team already. */
  alreadyMember: boolean;
}

export interface InvitationDescriptionResponse {
  invitation: InvitationDescription;
}

export interface AcceptedInvitationResponse {
  teamId: string;
  teamName: string;
  role: TeamRole;
}

export interface KeptMailItem {
  id: string;
  kind: "invitation" | "mention" | "review_request" | "review_decision";
  toAddress: string;
  subject: string;
  textBody: string;
  htmlBody: string | null;
  status: "kept" | "sent" | "failed";
  error: string;
  createdAt: string;
  sentAt: string | null;
}

export interface TeamMailResponse {
  /** "local": no SMTP settings, messages are only kept; "smtp": they are sent too. */
  mode: "local" | "smtp";
  messages: KeptMailItem[];
}
