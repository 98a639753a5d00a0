// One accuracy warning: what is wrong, for which part of the scene, and what to do about it.
export type AccuracyWarningCode =
  | "thin-wall"
  | "thin-solid"
  | "narrow-opening"
  | "receiver-near-surface"
  | "receiver-in-pml"
  | "receiver-near-pml"
  | "run-too-short"
  | "energy-not-decayed";

export interface AccuracyWarning {
  code: AccuracyWarningCode;
  /** The scene part concerned, as people name it ("wall \"Barrier\"", "receiver \"R1\""). */
  subject: string;
  message: string;
  /** What to do about it. */
  remedy: string;
}

export const named = (kind: string, entity: { id: string; label: string }) => `${kind} "${entity.label || entity.id}"`;

/** A length in metres with a sensible number of digits. */
export const metres = (value: number) => `${value < 1 ? value.toPrecision(2) : value.toFixed(value < 10 ? 2 : 1)} m`;
