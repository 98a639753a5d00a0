// The answers of the fork routes: where a scene may be forked to, and a scene's lineage (the
// scenes it came from and the forks made of it). Dates travel as ISO strings.
import type { SceneRecord } from "./api-types";

/** A study the caller may put a fork in (their role there allows scene:edit). */
export interface ForkTarget {
  studyId: string;
  studyTitle: string;
  teamId: string;
  teamName: string;
}

export interface ForkTargetsResponse {
  targets: ForkTarget[];
}

export interface ForkResponse {
  scene: SceneRecord;
}

/** The latest completed saved run of a scene, if it has one. */
export interface LineageRun {
  id: string;
  /** The version of the scene that was run. */
  sceneVersion: number;
  createdAt: string;
}

/**
 * A scene in a lineage, as far as the caller may see it. A scene in a team the caller is not on
 * shows only that it exists ("in another team"): no id, no name, no people. A deleted origin
 * shows that it is gone.
 */
export type LineageScene =
  | {
      access: "open";
      sceneId: string;
      name: string;
      /** The scene's current version. */
      version: number;
      studyId: string;
      studyTitle: string;
      teamName: string;
      latestRun: LineageRun | null;
    }
  | { access: "other-team" }
  | { access: "deleted" };

/** One step up: the scene this one (or the one below it) was forked from. */
export interface LineageOrigin {
  scene: LineageScene;
  /** The origin's version that was copied. */
  forkedVersion: number | null;
  /** Who wrote that version (null when hidden or unknown). */
  versionAuthorName: string | null;
}

/** One fork made from a scene, with the forks made from it in turn (a few levels deep). */
export interface LineageFork {
  scene: LineageScene;
  /** The parent's version that was copied. */
  forkedVersion: number | null;
  /** Who made the fork, and when (null when hidden). */
  forkedByName: string | null;
  forkedAt: string;
  forks: LineageFork[];
  /** True when there are deeper forks than the lineage lists. */
  moreBelow: boolean;
}

export interface LineageResponse {
  scene: { id: string; name: string; version: number; latestRun: LineageRun | null };
  /** Nearest origin first, up to the first scene that was not a fork. */
  origins: LineageOrigin[];
  forks: LineageFork[];
}
