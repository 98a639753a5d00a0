// The run-analysis harness page: design A of the demo (3 m barrier) run by lib/fdtd on this page, encoded
// and decoded as a saved run, and mounted in RunAnalysis. The study's run list and payloads are answered by
// a fetch stand-in on the page: the no-barrier reference and design B (4 m absorptive) as saved runs.
// Creating a scene answers 403, to show how a refused request reads.
import "@fontsource/ibm-plex-sans/400.css";
import "@fontsource/ibm-plex-sans/500.css";
import "@fontsource/ibm-plex-sans/600.css";
import "@fontsource/ibm-plex-mono/400.css";
import "./harness.css";

import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { StrictMode } from "react";
import { createRoot } from "react-dom/client";

import { RunAnalysis } from "@/components/analysis/run-analysis";
import { parseSceneOrThrow } from "@/lib/fdtd/scene";
import { Simulation } from "@/lib/fdtd/simulation";
import type { RunListItem, RunRecord } from "@/lib/http/api-types";
import { decodeRunPayload, encodeRunPayload, type DecodedRun } from "@/lib/run-record/payload";
import { summariseRun } from "@/lib/run-record/summary";

import designA from "../../../db/seed/scenes/design-a-3m-reflective.json";
import designB from "../../../db/seed/scenes/design-b-4m-absorptive.json";
import referenceScene from "../../../db/seed/scenes/reference-no-barrier.json";

declare global {
  interface Window {
    analysisHarness?: { ready: boolean; error?: string };
  }
}
window.analysisHarness = { ready: false };

interface SavedRun {
  id: string;
  name: string;
  bytes: Uint8Array<ArrayBuffer>;
  run: DecodedRun;
}

function saveRun(id: string, name: string, json: unknown): SavedRun {
  const scene = parseSceneOrThrow(json);
  const result = new Simulation(scene).run();
  const encoded = encodeRunPayload({ result, scene, sceneVersion: 1 });
  if (!encoded.ok) throw new Error(encoded.message);
  const decoded = decodeRunPayload(encoded.bytes);
  if (!decoded.ok) throw new Error(`${decoded.path}: ${decoded.message}`);
  return { id, name, bytes: encoded.bytes, run: decoded.run };
}

function listItem(saved: SavedRun, minute: number): RunListItem {
  const summary = summariseRun(saved.run);
  const { receivers: _receivers, warnings, ...figures } = summary;
  return {
    id: saved.id,
    studyId: "study-demo",
    sceneId: `scene-${saved.id}`,
    sceneName: saved.name,
    sceneVersion: 1,
    status: "completed",
    statusMessage: "",
    createdById: "user",
    createdByName: "Ines",
    createdAt: `2026-03-02T10:${String(minute).padStart(2, "0")}:00Z`,
    inputHash: saved.run.header.inputHash,
    solverVersion: saved.run.header.solverVersion,
    resultBytes: saved.bytes.length,
    reviewState: "unreviewed",
    signOff: null,
    sceneCurrentVersion: 1,
    figures: { ...figures, warningCount: warnings.length },
  };
}

function installFetch(saved: SavedRun[], items: RunListItem[]): void {
  const json = (body: unknown, status = 200) => new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json" } });
  window.fetch = async (input, init) => {
    const url = typeof input === "string" ? input : input instanceof URL ? input.href : input.url;
    const path = new URL(url, window.location.href).pathname;
    await new Promise((resolve) => setTimeout(resolve, 150));
    if (path === "/api/studies/study-demo/runs") return json({ runs: items });
    const result = /^\/api\/runs\/([^/]+)\/result$/.exec(path);
    if (result) {
      const found = saved.find((s) => s.id === result[1]);
      return found ? new Response(found.bytes, { headers: { "content-type": "application/octet-stream" } }) : json({ error: { code: "not_found:run", message: "No such run." } }, 404);
    }
    if (path === "/api/studies/study-demo/scenes" && init?.method === "POST") return json({ error: { code: "forbidden:study", message: "Your role in this team cannot add scenes (harness answer)." } }, 403);
    return json({ error: { code: "not_found:route", message: `The harness does not answer ${path}.` } }, 404);
  };
}

function start(): void {
  const current = saveRun("run-design-a", "Design A: 3 m reflective", designA);
  const reference = saveRun("run-reference", "Reference: no barrier", referenceScene);
  const other = saveRun("run-design-b", "Design B: 4 m absorptive", designB);
  const items = [listItem(current, 1), listItem(reference, 2), listItem(other, 3)];
  installFetch([current, reference, other], items);
  const record: RunRecord = { ...listItem(current, 1), teamId: "team", settings: current.run.header.settings, summary: summariseRun(current.run) };
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  createRoot(document.getElementById("root")!).render(
    <StrictMode>
      <QueryClientProvider client={client}>
        <main className="mx-auto flex max-w-6xl flex-col gap-4 p-6">
          <h1 className="text-xl font-semibold text-ink">Run analysis harness: {record.sceneName}</h1>
          <RunAnalysis runId={current.id} studyId="study-demo" record={record} run={current.run} canCreate />
        </main>
      </QueryClientProvider>
    </StrictMode>,
  );
  window.analysisHarness = { ready: true };
}

try {
  start();
} catch (error) {
  window.analysisHarness = { ready: false, error: error instanceof Error ? error.message : String(error) };
  document.body.textContent = `The harness could not start: ${window.analysisHarness.error}`;
}
