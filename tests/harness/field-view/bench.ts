// Timing of the field layer at 512 x 512 (the 60 fps goal): requestAnimationFrame loops of 2 s that
// clear only (the browser's own ceiling), upload one array again and again, and upload a new field each
// frame; then a back-to-back loop that waits for the GPU after each frame (a one-pixel readPixels) to give
// the full upload + draw cost. Reported, never asserted.
import { PRESSURE_SCALE } from "@/components/field-view/colour-scales";
import { createWebGlFieldRenderer, type FieldFrame } from "@/components/field-view/field-renderer";

export interface BenchmarkReport {
  renderer: string;
  grid: string;
  canvasPixels: string;
  /** The same loop clearing the canvas only: what the browser's compositor allows here at all. */
  clearOnlyFramesPerSecond: number;
  /** The same loop uploading one array over and over (a 1 MB working set instead of 24 MB). */
  sameValuesFramesPerSecond: number;
  animationFrames: number;
  animationSeconds: number;
  framesPerSecond: number;
  /** Main-thread time of render() (upload call + draw call), mean per frame, ms. */
  meanSubmitMilliseconds: number;
  /** Upload + draw with the GPU waited for, mean per frame over back-to-back frames, ms. */
  meanSynchronisedMilliseconds: number;
}

const SIZE = 512;

/** A few frames of an outgoing ring (a cylindrical pulse), so each frame uploads different values. */
function makeFrames(count: number): Float32Array[] {
  const frames: Float32Array[] = [];
  for (let k = 0; k < count; k++) {
    const values = new Float32Array(SIZE * SIZE);
    const front = 20 + (k * (SIZE * 0.6)) / count;
    for (let b = 0; b < SIZE; b++) {
      for (let a = 0; a < SIZE; a++) {
        const r = Math.hypot(a - SIZE / 2, b - SIZE / 2) + 0.5;
        const s = (r - front) / 6;
        values[b * SIZE + a] = ((1 - 2 * s * s) * Math.exp(-s * s)) / Math.sqrt(r);
      }
    }
    frames.push(values);
  }
  return frames;
}

export async function runBenchmark(canvas: HTMLCanvasElement): Promise<BenchmarkReport> {
  const ratio = window.devicePixelRatio || 1;
  const box = canvas.getBoundingClientRect();
  canvas.width = Math.round(box.width * ratio);
  canvas.height = Math.round(box.height * ratio);
  const renderer = createWebGlFieldRenderer(canvas);
  const frames = makeFrames(24);
  const frame: FieldFrame = {
    values: frames[0]!,
    width: SIZE,
    height: SIZE,
    low: -0.3,
    high: 0.3,
    scale: PRESSURE_SCALE,
    viewport: { x: 0, y: 0, width: canvas.width, height: canvas.height },
    clip: { x: 0, y: 0, width: canvas.width, height: canvas.height },
  };
  // Warm-up: texture creation, shader compilation.
  for (let k = 0; k < 5; k++) {
    frame.values = frames[k % frames.length]!;
    renderer.render(frame);
  }

  // Half a second of frames first: the software GL warms up its pipeline on the first presented frames.
  await animate(500);
  const clearOnly = await animate(2000, "clear");
  const sameValues = await animate(2000, "same");
  const animation = await animate(2000, "upload");

  function animate(milliseconds: number, work: "clear" | "same" | "upload" = "upload"): Promise<{ frames: number; seconds: number; submit: number }> {
    return new Promise((resolve) => {
      let count = 0;
      let submit = 0;
      const started = performance.now();
      const tick = () => {
        const now = performance.now();
        if (now - started >= milliseconds) {
          resolve({ frames: count, seconds: (now - started) / 1000, submit });
          return;
        }
        frame.values = frames[work === "upload" ? count % frames.length : 0]!;
        const before = performance.now();
        if (work === "clear") renderer.clear();
        else renderer.render(frame);
        submit += performance.now() - before;
        count++;
        requestAnimationFrame(tick);
      };
      requestAnimationFrame(tick);
    });
  }

  // The renderer's context; getContext returns the same one again.
  const gl = canvas.getContext("webgl")!;
  const pixel = new Uint8Array(4);
  const synchronisedFrames = 60;
  const before = performance.now();
  for (let k = 0; k < synchronisedFrames; k++) {
    frame.values = frames[k % frames.length]!;
    renderer.render(frame);
    gl.readPixels(0, 0, 1, 1, gl.RGBA, gl.UNSIGNED_BYTE, pixel);
  }
  const synchronised = (performance.now() - before) / synchronisedFrames;
  const report: BenchmarkReport = {
    renderer: renderer.kind,
    grid: `${SIZE} x ${SIZE}`,
    canvasPixels: `${canvas.width} x ${canvas.height}`,
    clearOnlyFramesPerSecond: Number((clearOnly.frames / clearOnly.seconds).toFixed(1)),
    sameValuesFramesPerSecond: Number((sameValues.frames / sameValues.seconds).toFixed(1)),
    animationFrames: animation.frames,
    animationSeconds: Number(animation.seconds.toFixed(3)),
    framesPerSecond: Number((animation.frames / animation.seconds).toFixed(1)),
    meanSubmitMilliseconds: Number((animation.submit / animation.frames).toFixed(3)),
    meanSynchronisedMilliseconds: Number(synchronised.toFixed(3)),
  };
  renderer.destroy();
  return report;
}
