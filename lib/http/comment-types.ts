// What the comment routes answer: a run's discussion as threads (first comment plus its replies).
import type { CommentPin } from "@/lib/validation/comment";

export interface MentionedMember {
  userId: string;
  name: string;
}

export interface CommentItem {
  id: string;
  runId: string;
  /** The thread's first comment, for a reply; null for a thread's first comment. */
  parentId: string | null;
  authorId: string | null;
  /** Null when the author's account is gone. */
  authorName: string | null;
  /** Markdown with mention tokens; empty once deleted. */
  body: string;
  pin: CommentPin | null;
  /** Members the body names (and were e-mailed), with their current names. */
  mentions: MentionedMember[];
  createdAt: string;
  editedAt: string | null;
  /** A deleted comment keeps its place (its replies stay) but not its text: shown as "comment deleted". */
  deleted: boolean;
  deletedAt: string | null;
  /** On a thread's first comment only. */
  resolvedAt: string | null;
  resolvedById: string | null;
  resolvedByName: string | null;
}

export interface CommentThread extends CommentItem {
  replies: CommentItem[];
  /** The latest of the thread's comments, edits and resolution: threads are listed newest activity first. */
  lastActivityAt: string;
}

export interface CommentsResponse {
  threads: CommentThread[];
}

export interface CommentResponse {
  comment: CommentItem;
}
