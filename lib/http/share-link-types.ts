// The shapes of read-only links: the owner's list of a study's links, and what the link itself answers to
// anyone who holds it. The shared answers carry only the one study's own content.
import type { RunSummary } from "@/lib/run-record/summary";
import type { BlockItem, RunListItem } from "./api-types";

export interface ShareLinkItem {
  id: string;
  label: string;
  createdByName: string | null;
  createdAt: string;
  /** Null while the link works. */
  revokedAt: string | null;
  revokedByName: string | null;
}

export interface ShareLinksResponse {
  links: ShareLinkItem[];
}

/** Answered once, when the link is made: the URL holds the secret, which is not kept anywhere. */
export interface ShareLinkCreatedResponse {
  link: ShareLinkItem;
  url: string;
}

export interface SharedStudyHeading {
  title: string;
  description: string;
  siteReference: string;
  teamName: string;
}

/** A scene as the shared view draws it. */
export interface SharedScene {
  id: string;
  name: string;
  description: string;
  isReference: boolean;
  version: number;
  data: unknown;
  updatedAt: string;
}

/**
 * A saved run as the shared view lists it: the run table's columns with where it stands in review (without
 * the user id of who saved it), and its full summary.
 */
export interface SharedRun extends RunListItem {
  createdById: null;
  summary: RunSummary | null;
}

export interface SharedStudyResponse {
  study: SharedStudyHeading;
  /** The notebook in order. */
  blocks: BlockItem[];
  scenes: SharedScene[];
  /** Newest first. */
  runs: SharedRun[];
}
