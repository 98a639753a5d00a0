// Exact (analytic) reference solutions that Rarefact's wave solver is verified against.
export type { Complex } from "./complex";
export { fresnelAuxiliary, fresnelC, fresnelIntegrals, fresnelS, type FresnelAuxiliary, type FresnelPair } from "./fresnel";
export { besselJ, besselY, freeFieldGreen2D, hankel1, hankel1Asymptotic, hankel2 } from "./hankel";
export { gaussianPulse, rickerWavelet, sampledSignal, type GaussianPulseOptions, type RickerOptions, type SourceSignal } from "./source-signals";
export { lineSourceImpulseResponse, lineSourcePressure, lineSourceTrace } from "./green2d";
export {
  distanceBetween,
  freeFieldGreenBetween,
  halfPlaneGreen,
  halfPlaneGreenSeries,
  halfPlaneInsertionLoss,
  polarAboutEdge,
  type EdgePolarPosition,
  type PlanePoint,
} from "./half-plane";
export { halfPlaneDiffractedUniformAsymptotic, halfPlaneGreenUniformAsymptotic, transitionFunction } from "./half-plane-asymptotic";
export { groupDegenerateModes, rigidRoomModes, roomModeFrequency, type DegenerateModeGroup, type RoomMode } from "./room-modes";
export {
  COURANT_LIMIT_2D,
  maxStableTimeStep,
  numericalAngularFrequency,
  numericalPhaseVelocity,
  numericalRoomModeFrequency,
  numericalWavenumber,
  type StaggeredGrid,
} from "./dispersion";
export { impedanceFromAbsorption, normalIncidenceAbsorption, normalIncidenceReflection, obliqueIncidenceAbsorption, obliqueIncidenceReflection } from "./impedance";
