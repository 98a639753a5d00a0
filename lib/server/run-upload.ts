// Checking an uploaded run before anything is stored: the payload must decode whole, come from this
// solver version, carry a frozen scene that parses and equals the saved scene version it names,
// carry the input hash the server recomputes, and describe a run of that scene. Any failure is a
// 400 naming the part that is wrong.
import "server-only";
import { getSceneVersionData } from "@/db/queries/scenes";
import { parseScene, type Scene } from "@/lib/fdtd/scene";
import { AppError, type FieldIssue } from "@/lib/http/app-error";
import { canonicalJson } from "@/lib/run-record/canonical-json";
import { FRAME_PREAMBLE_BYTES } from "@/lib/run-record/frame";
import { computeRunInputHash } from "@/lib/run-record/input-hash";
import { MAX_RUN_PAYLOAD_BYTES } from "@/lib/run-record/limits";
import { checkRunPayload, type CheckedRunPayload } from "@/lib/run-record/payload";
import { checkPayloadAgainstScene } from "@/lib/run-record/scene-match";
import { SOLVER_VERSION } from "@/lib/run-record/solver-version";
import { summariseRun, type RunSummary } from "@/lib/run-record/summary";

/** 64 MiB unless RAREFACT_MAX_RUN_UPLOAD_BYTES says otherwise; never above what the format admits. */
export const defaultRunUploadLimitBytes = 64 * 1024 * 1024;

export function runUploadLimitBytes(): number {
  const configured = Number(process.env.RAREFACT_MAX_RUN_UPLOAD_BYTES);
  const limit = Number.isInteger(configured) && configured > 0 ? configured : defaultRunUploadLimitBytes;
  return Math.min(limit, MAX_RUN_PAYLOAD_BYTES + FRAME_PREAMBLE_BYTES);
}

function rejected(issues: FieldIssue[]): AppError {
  const first = issues[0]!;
  return new AppError("bad_request:run", `${first.path}: ${first.message}`, issues);
}

export interface CheckedRunUpload {
  run: CheckedRunPayload;
  /** The frozen scene, parsed: what is stored as the run's scene snapshot. */
  scene: Scene;
  summary: RunSummary;
}

export async function checkRunUpload({ sceneId, bytes }: { sceneId: string; bytes: Uint8Array }): Promise<CheckedRunUpload> {
  const decoded = checkRunPayload(bytes);
  if (!decoded.ok) throw rejected([{ path: decoded.path, message: decoded.message }]);
  const { header } = decoded.run;

  if (header.solverVersion !== SOLVER_VERSION) {
    throw rejected([{ path: "header.solverVersion", message: `made by solver "${header.solverVersion}"; this server keeps runs of "${SOLVER_VERSION}". Reload the page and run again.` }]);
  }
  const frozen = parseScene(header.scene);
  if (!frozen.ok) throw rejected(frozen.problems.map((problem) => ({ path: problem.path ? `header.scene.${problem.path}` : "header.scene", message: problem.message })));

  const savedData = await getSceneVersionData({ sceneId, version: header.sceneVersion });
  if (savedData === null) throw rejected([{ path: "header.sceneVersion", message: `this scene has no saved version ${header.sceneVersion}` }]);
  const saved = parseScene(savedData);
  // Parsed on both sides, so defaults written out or left implicit compare alike.
  if (!saved.ok || canonicalJson(saved.scene) !== canonicalJson(frozen.scene)) {
    throw rejected([{ path: "header.scene", message: `the scene that was run is not version ${header.sceneVersion} as saved` }]);
  }

  const inputHash = computeRunInputHash({ scene: frozen.scene, settings: header.settings });
  if (inputHash !== header.inputHash) throw rejected([{ path: "header.inputHash", message: `the input hash does not match the scene and settings (expected ${inputHash})` }]);

  const mismatches = checkPayloadAgainstScene(header, frozen.scene);
  if (mismatches.length > 0) throw rejected(mismatches.map((issue) => ({ path: `header.${issue.path}`, message: issue.message })));

  return { run: decoded.run, scene: frozen.scene, summary: summariseRun(decoded.run) };
}
