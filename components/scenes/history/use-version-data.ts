"use client";
// The stored JSON of several saved versions at once, by version number. Saved versions never change,
// so each is fetched once per page and shared by the list's summaries and the comparison.
import { useQueries, type UseQueryResult } from "@tanstack/react-query";

import { sceneVersionQuery } from "@/lib/client/queries";
import type { SceneVersionDataResponse } from "@/lib/http/api-types";

export interface VersionData {
  /** Scene JSON by version number, for the versions that have arrived. */
  byVersion: ReadonlyMap<number, unknown>;
  /** Some version could not be fetched. */
  failed: boolean;
}

// At module level so that TanStack Query keeps the combined value while no result changes.
function combineVersions(results: UseQueryResult<SceneVersionDataResponse>[]): VersionData {
  const byVersion = new Map<number, unknown>();
  for (const result of results) if (result.data) byVersion.set(result.data.version, result.data.data);
  return { byVersion, failed: results.some((result) => result.isError) };
}

export function useVersionData(sceneId: string, versions: readonly number[]): VersionData {
  return useQueries({ queries: versions.map((version) => sceneVersionQuery(sceneId, version)), combine: combineVersions });
}
