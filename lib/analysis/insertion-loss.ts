// Insertion loss of a treatment (a barrier, an absorber): a run with it paired with a reference run without
// it, IL = L_reference - L_with, per receiver and band, and cell by cell over level maps.
import type { BandLevelTable } from "./band-levels";
import type { FrequencyBand } from "./bands";
import { gridMismatch, type LevelGrid } from "./level-grid";

/** What did not match between the two runs. */
export type MismatchSubject = "receivers" | "bands" | "grid";

/** The two runs cannot be paired; the message says what differs. */
export class RunMismatchError extends Error {
  readonly subject: MismatchSubject;
  constructor(subject: MismatchSubject, message: string) {
    super(message);
    this.name = "RunMismatchError";
    this.subject = subject;
  }
}

export interface ReceiverInsertionLoss {
  receiverId: string;
  label: string;
  /** One value per band of InsertionLossTable.bands, dB (positive: the treatment lowers the level). */
  insertionLoss: Float64Array;
  /** Difference of the overall levels, dB. */
  overall: number;
}

export interface InsertionLossTable {
  bandsPerOctave: BandLevelTable["bandsPerOctave"];
  weighting: BandLevelTable["weighting"];
  bands: FrequencyBand[];
  receivers: ReceiverInsertionLoss[];
}

const bandList = (bands: readonly FrequencyBand[]) => bands.map((band) => band.nominal).join(", ");

/** Both tables must hold the same bands, with the same weighting, or a difference would mix quantities. */
function checkSameBands(reference: BandLevelTable, withTreatment: BandLevelTable): void {
  if (reference.bandsPerOctave !== withTreatment.bandsPerOctave) {
    throw new RunMismatchError("bands", `the reference has 1/${reference.bandsPerOctave}-octave bands and the run with treatment 1/${withTreatment.bandsPerOctave}-octave bands`);
  }
  if (reference.weighting !== withTreatment.weighting) {
    throw new RunMismatchError("bands", `the reference is ${reference.weighting}-weighted and the run with treatment ${withTreatment.weighting}-weighted`);
  }
  const same = reference.bands.length === withTreatment.bands.length && reference.bands.every((band, b) => band.index === withTreatment.bands[b]?.index);
  if (!same) {
    throw new RunMismatchError("bands", `the runs report different bands (reference: ${bandList(reference.bands)} Hz; with treatment: ${bandList(withTreatment.bands)} Hz); their grids or durations probably differ`);
  }
}

/** Both tables must hold the same receivers, by id, with the same labels. */
function checkSameReceivers(reference: BandLevelTable, withTreatment: BandLevelTable): void {
  const referenceIds = new Set(reference.receivers.map((r) => r.receiverId));
  const treatedIds = new Set(withTreatment.receivers.map((r) => r.receiverId));
  const onlyInReference = [...referenceIds].filter((id) => !treatedIds.has(id));
  const onlyInTreated = [...treatedIds].filter((id) => !referenceIds.has(id));
  if (onlyInReference.length > 0 || onlyInTreated.length > 0) {
    const parts = [onlyInReference.length > 0 ? `only in the reference: ${onlyInReference.join(", ")}` : "", onlyInTreated.length > 0 ? `only in the run with treatment: ${onlyInTreated.join(", ")}` : ""];
    throw new RunMismatchError("receivers", `the runs have different receivers (${parts.filter(Boolean).join("; ")})`);
  }
  for (const receiver of reference.receivers) {
    const partner = withTreatment.receivers.find((r) => r.receiverId === receiver.receiverId);
    if (partner && partner.label !== receiver.label) {
      throw new RunMismatchError("receivers", `receiver ${receiver.receiverId} is labelled "${receiver.label}" in the reference and "${partner.label}" in the run with treatment`);
    }
  }
}

/** Per receiver and band IL = L_reference - L_with, dB; receivers in the reference's order. */
export function insertionLossTable(reference: BandLevelTable, withTreatment: BandLevelTable): InsertionLossTable {
  checkSameBands(reference, withTreatment);
  checkSameReceivers(reference, withTreatment);
  const receivers = reference.receivers.map((receiver) => {
    const partner = withTreatment.receivers.find((r) => r.receiverId === receiver.receiverId)!;
    return {
      receiverId: receiver.receiverId,
      label: receiver.label,
      insertionLoss: receiver.levels.map((level, b) => level - (partner.levels[b] ?? NaN)),
      overall: receiver.overall - partner.overall,
    };
  });
  return { bandsPerOctave: reference.bandsPerOctave, weighting: reference.weighting, bands: reference.bands, receivers };
}

/** IL map from two level maps (dB) on the same grid; NaN where either level is undefined (NaN or infinite). */
export function insertionLossMap(reference: LevelGrid, withTreatment: LevelGrid): LevelGrid {
  const mismatch = gridMismatch(reference, withTreatment);
  if (mismatch) throw new RunMismatchError("grid", `the level maps lie on different grids: ${mismatch}`);
  const values = new Float32Array(reference.values.length);
  for (let i = 0; i < values.length; i++) {
    const a = reference.values[i] ?? NaN;
    const b = withTreatment.values[i] ?? NaN;
    values[i] = Number.isFinite(a) && Number.isFinite(b) ? a - b : NaN;
  }
  return { width: reference.width, height: reference.height, x0: reference.x0, y0: reference.y0, spacing: reference.spacing, values };
}
