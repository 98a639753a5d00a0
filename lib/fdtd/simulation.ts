// A simulation of one scene: allocates the state once, steps it with a kernel, injects sources, records
// receivers, snapshots and level maps, watches the energy for instability and for the decay stop.
// Runs the same in Node, a Web Worker and tests; `run` is synchronous, `runAsync` yields between chunks.
import { deriveGrid, type GridPlan, type GridWarning } from "./grid";
import { FLUSH_INTERVAL, type StepKernel } from "./kernel";
import { defaultKernelProvider, typeScriptKernelProvider, type KernelProvider } from "./kernel-provider";
import type { StateLayout } from "./layout";
import { rasteriseScene, type RasterisedScene } from "./rasterise";
import { placeReceivers, receiverSpecs, sampleStencil, type PlacedReceiver } from "./receivers";
import { COURANT_LIMIT_2D, parseSceneOrThrow, type Scene } from "./scene";
import { placeSources, sourceIncrement, type PlacedSource } from "./sources";
import { accumulateIntensity, INTENSITY_SAMPLE_INTERVAL, type IntensityRegion } from "./intensity";
import { initialiseState, planState, type StateSetup } from "./state";

export interface SimulationOptions {
  /** Kernel to step with; by default the WebAssembly SIMD kernel where supported, else the TypeScript one. */
  kernel?: KernelProvider;
  /** A caller-supplied buffer (e.g. a SharedArrayBuffer for several workers); must hold `layout.byteLength` bytes. */
  buffer?: ArrayBufferLike;
  /** Steps between energy checks (instability, decay stop). */
  energyCheckInterval?: number;
  /**
   * Replaces the scene's Courant number without the stability check. Only for demonstrating the
   * instability detection in tests; user input always goes through `parseScene`.
   */
  unsafeCourantNumber?: number;
}

export interface ProgressReport {
  step: number;
  steps: number;
  fraction: number;
  simulatedSeconds: number;
  /** Acoustic energy relative to its peak so far, dB (at the last energy check). */
  energyDb: number;
}

export interface RunOptions {
  onProgress?: (progress: ProgressReport) => void;
  /** Minimum steps between progress reports (default: 1% of the run). */
  progressInterval?: number;
  /** Polled between chunks of steps: true stops the run (the result says "cancelled"). */
  isCancelled?: () => boolean;
  /** Also stops the run when aborted. */
  signal?: AbortSignal;
}

export interface ReceiverTrace {
  id: string;
  label: string;
  lineId?: string;
  /** Requested position, m. */
  position: { x: number; y: number };
  /** Sample n is at time n * timeStep, n = 0 .. stepsRun. */
  timeStep: number;
  /** Pa. */
  pressure: Float32Array;
  /** m/s, at the same times (mean of the staggered values at (n -/+ 1/2) dt). */
  velocityX: Float32Array;
  velocityY: Float32Array;
}

/** Values on a regular grid over the domain (PML left out): value (a, b) at scene position (x0 + a dx, y0 + b dx). */
export interface DomainGrid {
  /** Columns and rows; row-major, a fastest. */
  width: number;
  height: number;
  /** Scene position of value (0, 0), the centre of the first kept cell, m. */
  x0: number;
  y0: number;
  /** Spacing of the values, m. */
  spacing: number;
  values: Float32Array;
}

/** A pressure field over the domain at one time step, Pa. */
export interface FieldSnapshot extends DomainGrid {
  step: number;
  time: number;
}

export interface LevelMaps {
  /** Running peak |p| and root-mean-square pressure per domain cell, Pa; layout as FieldSnapshot. */
  peak: FieldSnapshot;
  rms: FieldSnapshot;
  /** Time steps accumulated. */
  samples: number;
}

export type StopReason = "duration" | "decay" | "cancelled";

export interface SimulationResult {
  grid: GridPlan;
  warnings: GridWarning[];
  kernel: string;
  stepsRun: number;
  simulatedSeconds: number;
  stoppedBy: StopReason;
  receivers: ReceiverTrace[];
  snapshots: FieldSnapshot[];
  finalPressure: FieldSnapshot;
  levelMaps?: LevelMaps;
  /** Time-averaged intensity <p v> per domain cell, W/m^2 (with the level maps); layout as FieldSnapshot. */
  intensity?: { x: FieldSnapshot; y: FieldSnapshot; samples: number };
  /** 1 inside a solid, per domain cell; layout as FieldSnapshot with spacing = cell size. */
  solidMask: Uint8Array;
  /** Acoustic energy per unit length (J/m) at each energy check. */
  energy: { step: number; time: number; joulesPerMetre: number }[];
  /** Where the sources actually act (cell centres), m. */
  sources: { id: string; label: string; x: number; y: number }[];
  timings: { setupSeconds: number; runSeconds: number; cellUpdatesPerSecond: number };
}

/** Thrown when the fields grow without bound; the message names the likely cause. */
export class SimulationInstabilityError extends Error {
  readonly code = "unstable";
  constructor(
    message: string,
    readonly step: number,
    readonly x: number,
    readonly y: number,
  ) {
    super(message);
    this.name = "SimulationInstabilityError";
  }
}

export type { KernelProvider } from "./kernel-provider";
export { typeScriptKernelProvider } from "./kernel-provider";

const now = (): number => (typeof performance !== "undefined" ? performance.now() : Date.now()) / 1000;

/** Rows [y0, y1) of `count` nearly equal horizontal strips. */
export function splitRows(ny: number, count: number): [number, number][] {
  const strips: [number, number][] = [];
  for (let k = 0; k < count; k++) strips.push([Math.floor((ny * k) / count), Math.floor((ny * (k + 1)) / count)]);
  return strips.filter(([a, b]) => b > a);
}

export class Simulation {
  readonly scene: Scene;
  readonly grid: GridPlan;
  readonly raster: RasterisedScene;
  readonly layout: StateLayout;
  readonly setup: StateSetup;
  readonly buffer: ArrayBufferLike;
  readonly kernel: StepKernel;
  readonly sources: PlacedSource[];
  readonly receivers: PlacedReceiver[];
  /** Completed steps: the pressure is at time step * dt. */
  step = 0;

  private readonly f: Float32Array;
  private readonly maxSteps: number;
  private readonly traces: { pressure: Float32Array; velocityX: Float32Array; velocityY: Float32Array }[];
  private readonly snapshots: FieldSnapshot[] = [];
  private readonly energy: { step: number; time: number; joulesPerMetre: number }[] = [];
  private readonly energyCheckInterval: number;
  private readonly transientEnd: number;
  private readonly setupSeconds: number;
  private readonly intensity?: { region: IntensityRegion; sumX: Float32Array; sumY: Float32Array; samples: number };
  private peakEnergy = 0;
  private lastEnergy = 0;
  private growthRun = 0;
  private decayReached = false;

  constructor(sceneInput: unknown, options: SimulationOptions = {}) {
    const started = now();
    const parsed = parseSceneOrThrow(sceneInput);
    this.scene = options.unsafeCourantNumber === undefined ? parsed : { ...parsed, resolution: { ...parsed.resolution, courantNumber: options.unsafeCourantNumber } };
    this.grid = deriveGrid(this.scene);
    this.raster = rasteriseScene(this.scene, this.grid);
    this.layout = planState(this.grid, this.raster, this.scene.output.levelMaps);
    // A caller-supplied buffer is stepped by the TypeScript kernel unless told otherwise.
    const provider = options.kernel ?? (options.buffer ? typeScriptKernelProvider() : defaultKernelProvider());
    if (options.buffer) {
      if (options.buffer.byteLength < this.layout.byteLength) throw new RangeError(`the supplied buffer holds ${options.buffer.byteLength} bytes; this scene needs ${this.layout.byteLength}`);
      new Uint8Array(options.buffer, 0, this.layout.byteLength).fill(0);
      this.buffer = options.buffer;
    } else {
      this.buffer = provider.allocate(this.layout.byteLength);
    }
    this.sources = placeSources(this.scene, this.grid, this.raster);
    const sourceScale = Math.max(0, ...this.sources.map((s, k) => Math.abs(s.amplitude) * s.pressurePerUnitRate * signalPeak(this.scene.sources[k]!.signal)));
    this.setup = initialiseState(this.buffer, this.layout, this.grid, this.raster, this.scene.attenuation?.dBPerMetre ?? 0, sourceScale);
    this.kernel = provider.create(this.buffer);
    this.f = new Float32Array(this.buffer);
    this.receivers = placeReceivers(receiverSpecs(this.scene), this.grid, this.raster, this.layout.stride);
    this.maxSteps = this.grid.steps;
    this.traces = this.receivers.map(() => ({
      pressure: new Float32Array(this.maxSteps + 1),
      velocityX: new Float32Array(this.maxSteps + 1),
      velocityY: new Float32Array(this.maxSteps + 1),
    }));
    // The energy pass reads three arrays once: every 128 steps it costs about 1% of the stepping.
    this.energyCheckInterval = options.energyCheckInterval ?? 128;
    this.transientEnd = Math.max(0, ...this.sources.map((s) => s.signal.endTime));
    if (this.scene.output.levelMaps) {
      const { pmlCells, domainCells } = this.grid;
      const cells = domainCells.nx * domainCells.ny;
      this.intensity = {
        region: { i0: pmlCells.left, j0: pmlCells.bottom, width: domainCells.nx, height: domainCells.ny },
        sumX: new Float32Array(cells),
        sumY: new Float32Array(cells),
        samples: 0,
      };
    }
    this.setupSeconds = now() - started;
  }

  /** Live views of the fields (row-major, i fastest, rows `stride` long). */
  fields(): { nx: number; ny: number; stride: number; pressure: Float32Array; velocityX: Float32Array; velocityY: Float32Array } {
    const { nx, ny, stride } = this.layout;
    const f = this.f;
    return {
      nx,
      ny,
      stride,
      pressure: f.subarray(this.layout.pressure, this.layout.pressure + ny * stride),
      velocityX: f.subarray(this.layout.velocityX, this.layout.velocityX + ny * stride),
      velocityY: f.subarray(this.layout.velocityY, this.layout.velocityY + (ny + 1) * stride),
    };
  }

  /**
   * One step n -> n+1 over the given strips (one strip, the whole grid, by default): every strip sweeps,
   * then every strip finishes, every FLUSH_INTERVAL steps every strip flushes tiny values, then the
   * sources add their pressure and the receivers record. Workers stepping strips in parallel keep these
   * phases apart with a barrier.
   */
  advance(strips: readonly (readonly [number, number])[] = [[0, this.layout.ny]]): void {
    for (const [y0, y1] of strips) this.kernel.sweepStrip(y0, y1);
    for (const [y0, y1] of strips) this.kernel.finishStrip(y0, y1);
    if ((this.step + 1) % FLUSH_INTERVAL === 0) for (const [y0, y1] of strips) this.kernel.flushStrip(y0, y1);
    this.injectSources();
    this.step++;
    this.recordReceivers();
    if (this.intensity && this.step % INTENSITY_SAMPLE_INTERVAL === 0) {
      const { pressure, velocityX, velocityY, stride } = this.layout;
      accumulateIntensity(this.f, pressure, velocityX, velocityY, stride, this.intensity.region, this.intensity.sumX, this.intensity.sumY);
      this.intensity.samples++;
    }
    const every = this.scene.output.snapshotEverySteps;
    if (every !== undefined && this.step % every === 0) this.snapshots.push(this.snapshot(this.scene.output.snapshotCellStride));
  }

  private injectSources(): void {
    const f = this.f;
    const base = this.layout.pressure;
    const stride = this.layout.stride;
    for (const source of this.sources) {
      const at = base + source.j * stride + source.i;
      f[at] = Math.fround(f[at]! + Math.fround(sourceIncrement(source, this.step, this.grid.timeStep)));
    }
  }

  private recordReceivers(): void {
    const n = this.step;
    const f = this.f;
    for (let r = 0; r < this.receivers.length; r++) {
      const receiver = this.receivers[r]!;
      const trace = this.traces[r]!;
      trace.pressure[n] = sampleStencil(f, this.layout.pressure, receiver.pressure);
      // Velocity at (n - 1/2) dt for now; shifted to n dt when the result is assembled.
      trace.velocityX[n - 1] = sampleStencil(f, this.layout.velocityX, receiver.velocityX);
      trace.velocityY[n - 1] = sampleStencil(f, this.layout.velocityY, receiver.velocityY);
    }
  }

  /** Acoustic energy per unit length, J/m: h^2 sum (p^2 / (2 rho c^2) + rho |v|^2 / 2) with background rho, c. */
  acousticEnergy(): number {
    const { nx, ny, stride } = this.layout;
    const f = this.f;
    let pressureSquares = 0;
    let velocitySquares = 0;
    for (let j = 0; j < ny; j++) {
      const p = this.layout.pressure + j * stride;
      const vx = this.layout.velocityX + j * stride;
      const vy = this.layout.velocityY + j * stride;
      for (let i = 0; i < nx; i++) {
        const a = f[p + i]!;
        const b = f[vx + i]!;
        const c = f[vy + i]!;
        pressureSquares += a * a;
        velocitySquares += b * b + c * c;
      }
    }
    const { density: rho, soundSpeed: c } = this.raster.media[0]!;
    const h2 = this.grid.cellSize * this.grid.cellSize;
    return h2 * (pressureSquares / (2 * rho * c * c) + 0.5 * rho * velocitySquares);
  }

  /** Records the energy; throws on non-finite or runaway growth; notes when the decay target is reached. */
  private checkEnergy(): void {
    const e = this.acousticEnergy();
    const time = this.step * this.grid.timeStep;
    this.energy.push({ step: this.step, time, joulesPerMetre: e });
    const sourcesDone = time > this.transientEnd;
    if (!Number.isFinite(e)) this.fail("the fields became infinite or NaN");
    if (sourcesDone && this.peakEnergy > 0 && e > 4 * this.peakEnergy) this.fail("the energy grew after every source had stopped");
    // Runaway growth while sources play: the energy of a stable scene grows at most polynomially.
    if (this.lastEnergy > 0 && e > 1.5 * this.lastEnergy && this.energy.length > 20) this.growthRun++;
    else this.growthRun = 0;
    if (this.growthRun >= 8) this.fail("the energy grew exponentially");
    this.peakEnergy = Math.max(this.peakEnergy, e);
    this.lastEnergy = e;
    if (this.scene.duration.kind === "decay" && sourcesDone && this.peakEnergy > 0) {
      const levelDb = 10 * Math.log10(e / this.peakEnergy);
      if (levelDb <= -this.scene.duration.decayDb) this.decayReached = true;
    }
  }

  private fail(what: string): never {
    const { i, j } = this.largestPressureCell();
    const x = this.grid.originX + (i + 0.5) * this.grid.cellSize;
    const y = this.grid.originY + (j + 0.5) * this.grid.cellSize;
    const cause = this.likelyCause(i, j);
    throw new SimulationInstabilityError(
      `unstable at step ${this.step} (t = ${(this.step * this.grid.timeStep).toExponential(3)} s): ${what}; largest pressure near (${x.toFixed(3)}, ${y.toFixed(3)}) m. Likely cause: ${cause}`,
      this.step,
      x,
      y,
    );
  }

  private largestPressureCell(): { i: number; j: number } {
    const { nx, ny, stride } = this.layout;
    let best = -1;
    let at = { i: 0, j: 0 };
    for (let j = 0; j < ny; j++) {
      for (let i = 0; i < nx; i++) {
        const v = this.f[this.layout.pressure + j * stride + i]!;
        const m = Number.isFinite(v) ? Math.abs(v) : Infinity;
        if (m > best) {
          best = m;
          at = { i, j };
          if (m === Infinity) return at;
        }
      }
    }
    return at;
  }

  private likelyCause(i: number, j: number): string {
    const { nx, ny, pmlCells } = this.grid;
    if (this.grid.courantNumber > COURANT_LIMIT_2D) return `the time step: Courant number ${this.grid.courantNumber} exceeds the 2D limit ${COURANT_LIMIT_2D.toFixed(4)}; lower it`;
    const near = (face: { i: number; j: number }) => Math.abs(face.i - i) <= 2 && Math.abs(face.j - j) <= 2;
    const impedanceFace = this.raster.boundaryFaces.find((face) => face.impedance !== Infinity && !face.thinWall && near(face));
    if (impedanceFace) return `the locally reacting surface there (normalised impedance ${impedanceFace.impedance.toPrecision(3)}); try a larger impedance or a smaller Courant number`;
    if (i < pmlCells.left || i >= nx - pmlCells.right || j < pmlCells.bottom || j >= ny - pmlCells.top) return "the PML there; try a thicker layer";
    if (this.raster.mediumIndex && this.raster.mediumIndex[j * nx + i]! > 0) return "the medium region there: its sound speed may exceed what the time step allows";
    return `the time step: Courant number ${this.grid.courantNumber} is close to the 2D limit ${COURANT_LIMIT_2D.toFixed(4)}; lower it`;
  }

  /** Domain part of the pressure field, every `stride`-th cell. */
  snapshot(cellStride = 1): FieldSnapshot {
    return this.domainField((offset) => this.f[this.layout.pressure + offset]!, cellStride);
  }

  private domainField(read: (offset: number) => number, cellStride: number): FieldSnapshot {
    const { pmlCells, domainCells, cellSize } = this.grid;
    const width = Math.ceil(domainCells.nx / cellStride);
    const height = Math.ceil(domainCells.ny / cellStride);
    const values = new Float32Array(width * height);
    for (let b = 0; b < height; b++) {
      const j = pmlCells.bottom + b * cellStride;
      for (let a = 0; a < width; a++) values[b * width + a] = read(j * this.layout.stride + pmlCells.left + a * cellStride);
    }
    return { step: this.step, time: this.step * this.grid.timeStep, width, height, x0: 0.5 * cellSize, y0: 0.5 * cellSize, spacing: cellSize * cellStride, values };
  }

  private meanIntensity(): SimulationResult["intensity"] {
    if (!this.intensity || this.intensity.samples === 0) return undefined;
    const { sumX, sumY, samples, region } = this.intensity;
    const { cellSize } = this.grid;
    const mean = (sum: Float32Array): FieldSnapshot => ({
      step: this.step,
      time: this.step * this.grid.timeStep,
      width: region.width,
      height: region.height,
      x0: 0.5 * cellSize,
      y0: 0.5 * cellSize,
      spacing: cellSize,
      values: sum.map((value) => value / samples),
    });
    return { x: mean(sumX), y: mean(sumY), samples };
  }

  private levelMaps(): LevelMaps | undefined {
    if (!this.layout.levelMaps) return undefined;
    const d = new Float64Array(this.buffer, 0, Math.floor(this.buffer.byteLength / 8));
    const samples = this.step;
    const peak = this.domainField((offset) => this.f[this.layout.peakPressure + offset]!, 1);
    const rms = this.domainField((offset) => (samples > 0 ? Math.sqrt(d[this.layout.pressureSquareSum + offset]! / samples) : 0), 1);
    return { peak, rms, samples };
  }

  private solidMask(): Uint8Array {
    const { pmlCells, domainCells, nx } = this.grid;
    const mask = new Uint8Array(domainCells.nx * domainCells.ny);
    for (let b = 0; b < domainCells.ny; b++) {
      for (let a = 0; a < domainCells.nx; a++) mask[b * domainCells.nx + a] = this.raster.solid[(pmlCells.bottom + b) * nx + pmlCells.left + a]!;
    }
    return mask;
  }

  private cancelled(options: RunOptions): boolean {
    return (options.isCancelled?.() ?? false) || (options.signal?.aborted ?? false);
  }

  /**
   * Runs `count` steps or until a stop condition; returns the stop reason, or undefined when the chunk ended.
   * Shared by `run` and `runAsync`.
   */
  private runChunk(count: number): StopReason | undefined {
    for (let k = 0; k < count; k++) {
      if (this.step >= this.maxSteps) return "duration";
      this.advance();
      // Check every interval, and once more at the last step so that a run never ends unchecked.
      if (this.step % this.energyCheckInterval === 0 || this.step === this.maxSteps) {
        this.checkEnergy();
        if (this.decayReached) return "decay";
      }
    }
    return this.step >= this.maxSteps ? "duration" : undefined;
  }

  private progress(): ProgressReport {
    return {
      step: this.step,
      steps: this.maxSteps,
      fraction: this.step / this.maxSteps,
      simulatedSeconds: this.step * this.grid.timeStep,
      energyDb: this.peakEnergy > 0 ? 10 * Math.log10(Math.max(this.lastEnergy, 1e-300) / this.peakEnergy) : 0,
    };
  }

  /** Runs to completion in this thread. */
  run(options: RunOptions = {}): SimulationResult {
    const started = now();
    const chunk = Math.max(1, options.progressInterval ?? Math.ceil(this.maxSteps / 100));
    let reason: StopReason | undefined;
    while (reason === undefined) {
      if (this.cancelled(options)) {
        reason = "cancelled";
        break;
      }
      reason = this.runChunk(chunk);
      options.onProgress?.(this.progress());
    }
    return this.result(reason, now() - started);
  }

  /** Runs to completion, yielding to the event loop between chunks so that messages (cancel) get through. */
  async runAsync(options: RunOptions = {}): Promise<SimulationResult> {
    const started = now();
    const chunk = Math.max(1, options.progressInterval ?? Math.ceil(this.maxSteps / 100));
    let reason: StopReason | undefined;
    while (reason === undefined) {
      await new Promise((resolve) => setTimeout(resolve, 0));
      if (this.cancelled(options)) {
        reason = "cancelled";
        break;
      }
      reason = this.runChunk(chunk);
      options.onProgress?.(this.progress());
    }
    return this.result(reason, now() - started);
  }

  private result(stoppedBy: StopReason, runSeconds: number): SimulationResult {
    const n = this.step;
    const receivers: ReceiverTrace[] = this.receivers.map((receiver, r) => {
      const trace = this.traces[r]!;
      return {
        id: receiver.id,
        label: receiver.label,
        ...(receiver.lineId !== undefined ? { lineId: receiver.lineId } : {}),
        position: receiver.position,
        timeStep: this.grid.timeStep,
        pressure: trace.pressure.slice(0, n + 1),
        velocityX: velocityAtPressureTimes(trace.velocityX, n),
        velocityY: velocityAtPressureTimes(trace.velocityY, n),
      };
    });
    const levelMaps = this.levelMaps();
    const intensity = this.meanIntensity();
    return {
      grid: this.grid,
      warnings: this.grid.warnings,
      kernel: this.kernel.name,
      stepsRun: n,
      simulatedSeconds: n * this.grid.timeStep,
      stoppedBy,
      receivers,
      snapshots: this.snapshots,
      finalPressure: this.snapshot(1),
      ...(levelMaps ? { levelMaps } : {}),
      ...(intensity ? { intensity } : {}),
      solidMask: this.solidMask(),
      energy: this.energy,
      sources: this.sources.map((s) => ({ id: s.id, label: s.label, x: s.x, y: s.y })),
      timings: { setupSeconds: this.setupSeconds, runSeconds, cellUpdatesPerSecond: runSeconds > 0 ? (this.grid.cellCount * n) / runSeconds : 0 },
    };
  }
}

/** Largest |value| of a signal before scaling by the source amplitude. */
function signalPeak(signal: Scene["sources"][number]["signal"]): number {
  if (signal.kind !== "sampled") return 1;
  let peak = 0;
  for (const v of signal.samples) peak = Math.max(peak, Math.abs(v));
  return peak;
}

/**
 * Staggered velocity samples (index k at (k + 1/2) dt, k < n) to the pressure times n dt: the mean of the
 * two neighbours; v(-1/2) = 0 before the start; the last sample is extrapolated linearly.
 */
function velocityAtPressureTimes(staggered: Float32Array, n: number): Float32Array {
  const out = new Float32Array(n + 1);
  for (let k = 0; k < n; k++) out[k] = 0.5 * ((k >= 1 ? staggered[k - 1]! : 0) + staggered[k]!);
  if (n >= 1) out[n] = 1.5 * staggered[n - 1]! - 0.5 * (n >= 2 ? staggered[n - 2]! : 0);
  return out;
}

/** Builds and runs a scene to completion in this thread. */
export function runScene(scene: unknown, options: SimulationOptions & RunOptions = {}): SimulationResult {
  return new Simulation(scene, options).run(options);
}
