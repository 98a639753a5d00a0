// Whether a sign-off still speaks for the scene as it is now. A run is frozen, so its sign-off never
// changes; but once the scene is saved again, the sign-off belongs to an older version of it, and
// every place that shows the sign-off says so.

export type SignOffStanding =
  | { kind: "current"; signedVersion: number }
  | { kind: "older"; signedVersion: number; currentVersion: number }
  | { kind: "scene_deleted"; signedVersion: number };

export function signOffStanding({ signedVersion, sceneCurrentVersion }: { signedVersion: number; sceneCurrentVersion: number | null }): SignOffStanding {
  if (sceneCurrentVersion === null) return { kind: "scene_deleted", signedVersion };
  if (sceneCurrentVersion > signedVersion) return { kind: "older", signedVersion, currentVersion: sceneCurrentVersion };
  return { kind: "current", signedVersion };
}

/** One sentence for the standing, or null when the sign-off is for the scene as it is now. */
export function signOffStandingNotice(standing: SignOffStanding): string | null {
  if (standing.kind === "older") {
    return `Signed off for version ${standing.signedVersion} of the scene; the scene is now at version ${standing.currentVersion}. This sign-off belongs to the older version.`;
  }
  if (standing.kind === "scene_deleted") return `Signed off for version ${standing.signedVersion} of a scene that has since been deleted.`;
  return null;
}

/** The first characters of a run hash, as shown beside the full hash in a tooltip. */
export function shortHash(hash: string, length = 12): string {
  return hash.slice(0, length);
}
