// A fork beside its origin: their settings as rows of plain text with the differences marked, their
// receivers paired, and the insertion loss of the fork relative to its origin per octave band (the
// origin's band level minus the fork's; positive where the fork is quieter). Pure: the comparison
// page computes band levels with lib/analysis and hands them here.
import type { BandLevelTable } from "@/lib/analysis/band-levels";
import type { FrequencyBand } from "@/lib/analysis/bands";
import { deriveGrid } from "@/lib/fdtd/grid";
import { MATERIALS } from "@/lib/fdtd/materials";
import type { Edge, Point, Scene, Signal, SurfaceTreatment } from "@/lib/fdtd/scene";

// ---------------------------------------------------------------------------------------------
// Settings

export interface SettingRow {
  /** Stable within a comparison: the group and what the row describes (an entity id where there is one). */
  key: string;
  label: string;
  /** "—" where the scene has no such thing. */
  origin: string;
  fork: string;
  differs: boolean;
}

export interface SettingGroup {
  title: string;
  rows: SettingRow[];
}

/** What a scene lacks in a row (an entity only the other scene has). */
export const ABSENT = "—";

const figure = new Intl.NumberFormat("en-GB", { maximumSignificantDigits: 4 });
const num = (value: number) => figure.format(value);
const metres = (value: number) => `${num(value)} m`;
const point = (p: Point) => `(${num(p.x)}, ${num(p.y)}) m`;

export function describeTreatment(treatment: SurfaceTreatment | Edge): string {
  switch (treatment.kind) {
    case "pml":
      return `absorbing layer (PML), ${treatment.layerCells} cells`;
    case "rigid":
      return "rigid";
    case "impedance":
      return `impedance z = ${num(treatment.normalisedImpedance)}`;
    case "absorption":
      return `absorption α = ${num(treatment.absorptionCoefficient)}`;
    case "material":
      return `${MATERIALS[treatment.material].label} (α = ${num(MATERIALS[treatment.material].absorption)})`;
  }
}

function describeSignal(signal: Signal): string {
  switch (signal.kind) {
    case "ricker":
      return `Ricker pulse, peak ${num(signal.peakFrequency)} Hz`;
    case "gaussianPulse":
      return `Gaussian pulse, σ = ${num(signal.width * 1000)} ms`;
    case "toneBurst":
      return `tone burst ${num(signal.frequency)} Hz, ${num(signal.cycles)} cycles`;
    case "sine":
      return `sine ${num(signal.frequency)} Hz`;
    case "sampled":
      return `recorded signal, ${signal.samples.length} samples at ${num(signal.sampleRate)} Hz`;
  }
}

function describeMedium(medium: Scene["medium"]): string {
  return medium.kind === "air" ? `air at ${num(medium.temperature)} °C` : `fluid, c = ${num(medium.soundSpeed)} m/s, ρ = ${num(medium.density)} kg/m³`;
}

function describeResolution(resolution: Scene["resolution"]): string {
  return resolution.kind === "frequency"
    ? `up to ${num(resolution.maxFrequency)} Hz at ${num(resolution.pointsPerWavelength)} cells per wavelength`
    : `cell size set to ${num(resolution.cellSize * 1000)} mm`;
}

function describeDuration(duration: Scene["duration"]): string {
  return duration.kind === "time" ? `${num(duration.seconds * 1000)} ms` : `until ${num(duration.decayDb)} dB of decay, at most ${num(duration.maxSeconds * 1000)} ms`;
}

/** Extent of a list of points: width, height and the top edge, m. */
function extent(points: readonly Point[]): { width: number; height: number; top: number } {
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  for (const p of points) {
    minX = Math.min(minX, p.x);
    maxX = Math.max(maxX, p.x);
    minY = Math.min(minY, p.y);
    maxY = Math.max(maxY, p.y);
  }
  return { width: maxX - minX, height: maxY - minY, top: maxY };
}

function pathLength(path: readonly Point[]): number {
  let length = 0;
  for (let i = 1; i < path.length; i++) length += Math.hypot(path[i]!.x - path[i - 1]!.x, path[i]!.y - path[i - 1]!.y);
  return length;
}

function row(key: string, label: string, origin: string, fork: string): SettingRow {
  return { key, label, origin, fork, differs: origin !== fork };
}

/** One row per entity, matched by id over both scenes (origin's order first, then the fork's new ones). */
function entityRows<T extends { id: string; label: string }>(keyPrefix: string, what: string, origin: readonly T[], fork: readonly T[], describe: (item: T) => string): SettingRow[] {
  const ids = [...origin.map((item) => item.id), ...fork.map((item) => item.id).filter((id) => !origin.some((item) => item.id === id))];
  return ids.map((id) => {
    const a = origin.find((item) => item.id === id);
    const b = fork.find((item) => item.id === id);
    const name = b?.label || a?.label || id;
    return row(`${keyPrefix}:${id}`, `${what} “${name}”`, a ? describe(a) : ABSENT, b ? describe(b) : ABSENT);
  });
}

function derivedGrid(scene: Scene): { cellSize: string; resolved: string; cells: string } {
  try {
    const grid = deriveGrid(scene);
    return { cellSize: `${num(grid.cellSize * 1000)} mm`, resolved: `${num(grid.maxResolvedFrequency)} Hz`, cells: `${grid.nx} × ${grid.ny} cells` };
  } catch {
    return { cellSize: "cannot be derived", resolved: "cannot be derived", cells: "cannot be derived" };
  }
}

/** The materials a scene uses anywhere (edges, solids, walls, surfaces), sorted, one line. */
function materialsUsed(scene: Scene): string {
  const used = new Set<string>();
  const add = (treatment: SurfaceTreatment | Edge) => {
    if (treatment.kind !== "pml") used.add(describeTreatment(treatment));
  };
  for (const side of ["left", "right", "bottom", "top"] as const) add(scene.boundary[side]);
  scene.geometry.solids.forEach((solid) => add(solid.surface));
  scene.geometry.walls.forEach((wall) => add(wall.surface));
  scene.geometry.surfaces.forEach((surface) => add(surface.treatment));
  return used.size === 0 ? "none" : [...used].sort().join("; ");
}

/** Every setting of the two scenes side by side, grouped as an engineer checks them. */
export function compareSceneSettings(origin: Scene, fork: Scene): SettingGroup[] {
  const gridA = derivedGrid(origin);
  const gridB = derivedGrid(fork);
  const both = <T>(get: (scene: Scene) => T, describe: (value: T) => string) => [describe(get(origin)), describe(get(fork))] as const;
  const countOf = (list: readonly unknown[]) => String(list.length);

  const groups: SettingGroup[] = [
    {
      title: "Domain and medium",
      rows: [
        row("domain", "Domain", ...both((s) => s.domain, (d) => `${metres(d.width)} × ${metres(d.height)}`)),
        row("medium", "Medium", ...both((s) => s.medium, describeMedium)),
        row("medium-regions", "Regions of another medium", ...both((s) => s.mediumRegions, countOf)),
        row("attenuation", "Added attenuation", ...both((s) => s.attenuation, (a) => (a ? `${num(a.dBPerMetre)} dB/m` : "none"))),
        row("duration", "Duration", ...both((s) => s.duration, describeDuration)),
      ],
    },
    {
      title: "Resolution",
      rows: [
        row("resolution", "Resolution asked for", ...both((s) => s.resolution, describeResolution)),
        row("cell-size", "Cell size", gridA.cellSize, gridB.cellSize),
        row("resolved", "Highest resolved frequency", gridA.resolved, gridB.resolved),
        row("courant", "Courant number", ...both((s) => s.resolution.courantNumber, num)),
        row("grid", "Grid, absorbing layers included", gridA.cells, gridB.cells),
      ],
    },
    {
      title: "Boundaries",
      rows: (["left", "right", "bottom", "top"] as const).map((side) => row(`boundary:${side}`, `${side[0]!.toUpperCase()}${side.slice(1)} edge`, ...both((s) => s.boundary[side], describeTreatment))),
    },
    {
      title: "Sources",
      rows: [
        row("sources", "Sources", ...both((s) => s.sources, countOf)),
        ...entityRows("source", "Source", origin.sources, fork.sources, (source) => `${point(source.position)}; ${describeSignal(source.signal)}; amplitude ${num(source.amplitude)}`),
      ],
    },
    {
      title: "Receivers",
      rows: [
        row("receivers", "Point receivers", ...both((s) => s.receivers, countOf)),
        ...entityRows("receiver", "Receiver", origin.receivers, fork.receivers, (receiver) => point(receiver.position)),
        row("receiver-lines", "Receiver lines", ...both((s) => s.receiverLines, countOf)),
        ...entityRows("receiver-line", "Line", origin.receiverLines, fork.receiverLines, (line) => `${point(line.from)} to ${point(line.to)}, ${line.count} receivers`),
      ],
    },
    {
      title: "Barriers and solids",
      rows: [
        row("solids", "Solids", ...both((s) => s.geometry.solids, countOf)),
        ...entityRows("solid", "Solid", origin.geometry.solids, fork.geometry.solids, (solid) => {
          const box = extent(solid.polygon);
          return `${metres(box.width)} wide, ${metres(box.height)} high, top at ${metres(box.top)}; ${describeTreatment(solid.surface)}`;
        }),
        row("walls", "Walls and thin barriers", ...both((s) => s.geometry.walls, countOf)),
        ...entityRows("wall", "Wall", origin.geometry.walls, fork.geometry.walls, (wall) => {
          const box = extent(wall.path);
          return `${metres(pathLength(wall.path))} long, ${metres(wall.thickness)} thick, top at ${metres(box.top)}; ${describeTreatment(wall.surface)}`;
        }),
        row("surfaces", "Treated surfaces", ...both((s) => s.geometry.surfaces, countOf)),
        ...entityRows("surface", "Surface", origin.geometry.surfaces, fork.geometry.surfaces, (surface) => `${metres(pathLength(surface.path))} long; ${describeTreatment(surface.treatment)}`),
      ],
    },
    {
      title: "Materials",
      rows: [row("materials", "Surface treatments used", materialsUsed(origin), materialsUsed(fork))],
    },
  ];
  return groups;
}

/** How many rows differ over all groups. */
export function countDifferences(groups: readonly SettingGroup[]): number {
  return groups.reduce((sum, group) => sum + group.rows.filter((r) => r.differs).length, 0);
}

// ---------------------------------------------------------------------------------------------
// Receivers and insertion loss

export interface ReceiverPlace {
  id: string;
  label: string;
  position: Point;
}

export interface ReceiverPair {
  originId: string;
  forkId: string;
  /** The fork's label (the origin's when the fork's is empty). */
  label: string;
  matchedBy: "id" | "name" | "position";
}

/**
 * Pairs each receiver of the origin's run with at most one of the fork's: the same id first, then
 * the same name (where it is unique on both sides), then the nearest unpaired receiver within
 * `tolerance` metres (a cell: the grids may differ, so "the same place" means the same cell).
 */
export function pairReceivers(origin: readonly ReceiverPlace[], fork: readonly ReceiverPlace[], tolerance: number): ReceiverPair[] {
  const pairs: ReceiverPair[] = [];
  const usedOrigin = new Set<string>();
  const usedFork = new Set<string>();
  const pair = (a: ReceiverPlace, b: ReceiverPlace, matchedBy: ReceiverPair["matchedBy"]) => {
    pairs.push({ originId: a.id, forkId: b.id, label: b.label || a.label || b.id, matchedBy });
    usedOrigin.add(a.id);
    usedFork.add(b.id);
  };

  for (const a of origin) {
    const b = fork.find((candidate) => candidate.id === a.id);
    if (b) pair(a, b, "id");
  }
  const uniqueByName = (list: readonly ReceiverPlace[], used: Set<string>) => {
    const byName = new Map<string, ReceiverPlace | null>();
    for (const item of list) {
      const name = item.label.trim();
      if (!name || used.has(item.id)) continue;
      byName.set(name, byName.has(name) ? null : item);
    }
    return byName;
  };
  const forkNames = uniqueByName(fork, usedFork);
  for (const [name, a] of uniqueByName(origin, usedOrigin)) {
    const b = forkNames.get(name);
    if (a && b) pair(a, b, "name");
  }
  for (const a of origin) {
    if (usedOrigin.has(a.id)) continue;
    let nearest: ReceiverPlace | undefined;
    let nearestDistance = Infinity;
    for (const b of fork) {
      if (usedFork.has(b.id)) continue;
      const distance = Math.hypot(a.position.x - b.position.x, a.position.y - b.position.y);
      if (distance <= tolerance && distance < nearestDistance) {
        nearest = b;
        nearestDistance = distance;
      }
    }
    if (nearest) pair(a, nearest, "position");
  }
  // In the origin's order, so the table reads like the origin's receiver list.
  const order = new Map(origin.map((item, index) => [item.id, index]));
  return pairs.sort((x, y) => (order.get(x.originId) ?? 0) - (order.get(y.originId) ?? 0));
}

export interface ReceiverForkLoss {
  pair: ReceiverPair;
  /** One value per band of ForkInsertionLoss.bands, dB: origin minus fork (positive: the fork is quieter). */
  insertionLoss: number[];
  /** Over the common bands, dB. */
  overall: number;
}

export interface ForkInsertionLoss {
  /** The bands both runs resolve, low to high. */
  bands: FrequencyBand[];
  receivers: ReceiverForkLoss[];
  /** True when the runs' durations differ (levels are compared as exposure, which allows for it). */
  durationsDiffer: boolean;
}

function energy(level: number): number {
  return Number.isFinite(level) ? Math.pow(10, level / 10) : 0;
}

/**
 * Insertion loss of the fork relative to its origin per receiver pair and band: origin band level
 * minus fork band level, only in the bands both tables report. Band levels are energy means over a
 * run's whole trace; each is turned into a band exposure (level + 10 lg T) first, so two runs of a
 * transient that dies out within both compare fairly even when their durations differ.
 */
export function forkInsertionLoss(origin: BandLevelTable, fork: BandLevelTable, pairs: readonly ReceiverPair[]): ForkInsertionLoss {
  const forkBandIndex = new Map(fork.bands.map((band, b) => [band.index, b]));
  const common = origin.bands.flatMap((band, b) => {
    const f = forkBandIndex.get(band.index);
    return f === undefined ? [] : [{ band, originIndex: b, forkIndex: f }];
  });
  const exposure = (table: BandLevelTable) => 10 * Math.log10(table.averagingTime);
  const offset = exposure(origin) - exposure(fork);
  const receivers: ReceiverForkLoss[] = [];
  for (const pair of pairs) {
    const a = origin.receivers.find((r) => r.receiverId === pair.originId);
    const b = fork.receivers.find((r) => r.receiverId === pair.forkId);
    if (!a || !b) continue;
    let energyA = 0;
    let energyB = 0;
    const insertionLoss = common.map(({ originIndex, forkIndex }) => {
      const levelA = a.levels[originIndex] ?? NaN;
      const levelB = b.levels[forkIndex] ?? NaN;
      energyA += energy(levelA);
      energyB += energy(levelB);
      return levelA - levelB + offset;
    });
    receivers.push({ pair, insertionLoss, overall: 10 * Math.log10(energyA / energyB) + offset });
  }
  return { bands: common.map((c) => c.band), receivers, durationsDiffer: Math.abs(origin.averagingTime - fork.averagingTime) > 1e-9 * Math.max(origin.averagingTime, fork.averagingTime) };
}
