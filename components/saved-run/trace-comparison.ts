// Checking a repeated run against a saved one, sample by sample. Runs of one solver version on the
// same input are bit-identical (any thread count, either kernel), so "identical" means every
// float32 sample equal; otherwise the largest difference says how far apart they are.
import type { ReceiverTrace } from "@/lib/fdtd/simulation";

export type TraceQuantity = "pressure" | "velocityX" | "velocityY";
const quantities: readonly TraceQuantity[] = ["pressure", "velocityX", "velocityY"];

export interface LargestDifference {
  receiverId: string;
  receiverLabel: string;
  quantity: TraceQuantity;
  /** Sample index n (time n * timeStep). */
  sample: number;
  saved: number;
  repeated: number;
  /** |repeated - saved|, in the quantity's unit (Pa or m/s). */
  difference: number;
  /** The difference over the saved trace's largest magnitude (0 when that trace is silent). */
  relativeToPeak: number;
}

export type TraceComparison =
  | { kind: "identical"; receivers: number; samples: number }
  | { kind: "different"; receivers: number; samples: number; differingSamples: number; largest: LargestDifference }
  /** The two runs did not record the same receivers or the same number of samples. */
  | { kind: "incomparable"; reason: string };

type Trace = Pick<ReceiverTrace, "id" | "label" | "pressure" | "velocityX" | "velocityY">;

function largestMagnitude(values: Float32Array): number {
  let largest = 0;
  for (let n = 0; n < values.length; n++) largest = Math.max(largest, Math.abs(values[n]!));
  return largest;
}

export function compareReceiverTraces(saved: readonly Trace[], repeated: readonly Trace[]): TraceComparison {
  if (saved.length !== repeated.length) return { kind: "incomparable", reason: `the saved run has ${saved.length} receivers, the repeated run ${repeated.length}` };
  let differingSamples = 0;
  let samples = 0;
  let largest: LargestDifference | null = null;
  for (const [index, savedTrace] of saved.entries()) {
    const repeatedTrace = repeated[index]!;
    if (repeatedTrace.id !== savedTrace.id) return { kind: "incomparable", reason: `receiver ${index + 1} is "${savedTrace.id}" in the saved run and "${repeatedTrace.id}" in the repeated run` };
    for (const quantity of quantities) {
      const a = savedTrace[quantity];
      const b = repeatedTrace[quantity];
      if (a.length !== b.length) return { kind: "incomparable", reason: `receiver "${savedTrace.id}" has ${a.length} samples saved and ${b.length} repeated` };
      const peak = largestMagnitude(a);
      for (let n = 0; n < a.length; n++) {
        const difference = Math.abs(b[n]! - a[n]!);
        // Object.is tells -0 from 0 and NaN from NaN like a bit comparison would (NaN is never saved).
        if (Object.is(a[n], b[n])) continue;
        differingSamples++;
        if (largest === null || difference > largest.difference || (Number.isNaN(difference) && !Number.isNaN(largest.difference))) {
          largest = { receiverId: savedTrace.id, receiverLabel: savedTrace.label, quantity, sample: n, saved: a[n]!, repeated: b[n]!, difference, relativeToPeak: peak > 0 ? difference / peak : 0 };
        }
      }
    }
    samples = Math.max(samples, savedTrace.pressure.length);
  }
  if (largest === null) return { kind: "identical", receivers: saved.length, samples };
  return { kind: "different", receivers: saved.length, samples, differingSamples, largest };
}
