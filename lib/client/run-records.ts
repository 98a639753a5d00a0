// Saved runs from the browser's side: pack a finished run into its payload and upload it, and fetch
// a saved run's payload and read it back. Errors arrive as ApiError, like every other call.
import type { Scene } from "@/lib/fdtd/scene";
import type { SimulationResult } from "@/lib/fdtd/simulation";
import { isErrorBody } from "@/lib/http/app-error";
import type { RunRecord } from "@/lib/http/api-types";
import { decodeRunPayload, encodeRunPayload, type DecodedRun } from "@/lib/run-record/payload";
import type { RunSettings } from "@/lib/run-record/settings";
import { ApiError, fetchJson } from "./api";

export interface SaveRunInput {
  sceneId: string;
  /** The saved version of the scene that was run: the server checks the run against it. */
  sceneVersion: number;
  /** That version's scene, after parseScene (as it was handed to the simulation). */
  scene: Scene;
  result: SimulationResult;
  /** Worker threads that stepped the run, recorded with it. */
  threads?: number;
  settings?: RunSettings;
}

/** Encodes the run and uploads it; resolves to the saved run's record. */
export async function saveRunRecord(input: SaveRunInput): Promise<RunRecord> {
  const encoded = encodeRunPayload({ result: input.result, scene: input.scene, sceneVersion: input.sceneVersion, settings: input.settings, threads: input.threads });
  if (!encoded.ok) throw new ApiError(0, "bad_request:run", encoded.message);
  const { run } = await fetchJson<{ run: RunRecord }>(`/api/scenes/${input.sceneId}/runs`, {
    method: "POST",
    headers: { "content-type": "application/octet-stream" },
    body: encoded.bytes,
  });
  return run;
}

/** Downloads a saved run's payload (the browser caches it: a saved run never changes) and decodes it. */
export function fetchSavedRun(runId: string): Promise<DecodedRun> {
  return fetchRunPayload(`/api/runs/${runId}/result`, "same-origin");
}

/** Downloads a run payload from `url` and decodes it; errors keep the server's code and message. */
export async function fetchRunPayload(url: string, credentials: RequestCredentials): Promise<DecodedRun> {
  let response: Response;
  try {
    response = await fetch(url, { credentials });
  } catch {
    throw new ApiError(0, "network", "The server could not be reached. Check your connection and try again.");
  }
  if (!response.ok) {
    const body: unknown = await response.json().catch(() => null);
    if (isErrorBody(body)) throw new ApiError(response.status, body.error.code, body.error.message, body.error.issues ?? []);
    throw new ApiError(response.status, "unknown", `The server answered ${response.status}.`);
  }
  const decoded = decodeRunPayload(new Uint8Array(await response.arrayBuffer()));
  if (!decoded.ok) throw new ApiError(response.status, "corrupt:run", `The saved run could not be read: ${decoded.path}: ${decoded.message}`);
  return decoded.run;
}
