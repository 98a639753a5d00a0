// What the verification page lists: exactly the cases `npm test` runs (lib/verification/cases, one
// definition), and the figures of each case's principal scene as the page states them.
import { deriveGrid, type GridPlan } from "@/lib/fdtd/grid";
import { parseScene, type Scene } from "@/lib/fdtd/scene";
import { verificationCases, type VerificationCase } from "@/lib/verification/cases";

/** The page's list: the shared list itself, not a copy, so it cannot drift from the tests. */
export const pageVerificationCases: readonly VerificationCase[] = verificationCases;

export interface CaseSceneFacts {
  scene: Scene;
  grid: GridPlan;
  rows: [string, string][];
}

const figure = (value: number, digits = 4) => String(Number(value.toPrecision(digits)));

/** The case's principal scene, parsed, with its grid in figures; null for a case that runs no simulation. */
export function caseSceneFacts(verificationCase: VerificationCase): CaseSceneFacts | null {
  if (!verificationCase.scene) return null;
  const parsed = parseScene(verificationCase.scene());
  if (!parsed.ok) return null;
  const scene = parsed.scene;
  const grid = deriveGrid(scene);
  const receivers = scene.receivers.length + scene.receiverLines.reduce((sum, line) => sum + line.count, 0);
  const rows: [string, string][] = [
    ["Domain", `${figure(scene.domain.width)} m × ${figure(scene.domain.height)} m`],
    ["Cell size", `${figure(grid.cellSize * 1000)} mm`],
    ["Grid incl. PML", `${grid.nx} × ${grid.ny} = ${grid.cellCount.toLocaleString("en-GB")} cells`],
    ["Time step", `${figure(grid.timeStep * 1e6)} µs (Courant number ${figure(grid.courantNumber, 3)})`],
    ["Steps", `${grid.steps.toLocaleString("en-GB")} (${figure(grid.simulatedSeconds * 1000)} ms simulated)`],
    ["Sources, receivers", `${scene.sources.length}, ${receivers}`],
  ];
  return { scene, grid, rows };
}
