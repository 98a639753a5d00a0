// Per-run accuracy estimate (issue #9): ratings per band, distances in wavelengths, warnings; and the one
// decision of which bands are resolved, shared by every band table, chart, spectrum and export.
export { type BandAccuracy, bandAccuracy, bandAccuracyTable, type BandRating } from "./band-accuracy";
export { accuracySummary, bandsToUseWithCare, ratedBandsOf, USE_WITH_CARE_LEGEND, USE_WITH_CARE_MARK } from "./band-cautions";
export { geometryWarnings, polygonThickness } from "./geometry-warnings";
export { axisPhaseErrorOver, axisPhaseErrorPerWavelength, pointsPerWavelength } from "./phase-error";
export { receiverWarnings } from "./receiver-warnings";
export { resolvedFrequencyLimit, unresolvedBand } from "./resolved-range";
export { distanceInWavelengths, type ReceiverDistances, runAccuracy, type RunAccuracy } from "./run-accuracy";
export { arrivalWarning, decayWarning, finalEnergyRelativeToPeak, type RunEnding } from "./run-warnings";
export * from "./thresholds";
export type { AccuracyWarning, AccuracyWarningCode } from "./warning";
