// The solver's public surface: scene format, derived grid, simulation, kernels, materials.
export * from "./scene";
export { MATERIAL_IDS, MATERIALS, absorptionFromImpedance, impedanceFromAbsorption, materialImpedance, reflectionFromImpedance, type Material, type MaterialId } from "./materials";
export { cellCentreX, cellCentreY, deriveGrid, type GridPlan, type GridWarning } from "./grid";
export { speedOfSoundInAir, densityOfAir, mediumProperties, type MediumProperties } from "./medium";
export { prepareSignal, ricker, type SignalEvaluator } from "./signals";
export { buildScene, pointReceiver, pointSource, traceTimes } from "./builders";
export { FLUSH_INTERVAL, type StepKernel } from "./kernel";
export { defaultKernelProvider, typeScriptKernelProvider, type KernelProvider } from "./kernel-provider";
export {
  runScene,
  Simulation,
  SimulationInstabilityError,
  splitRows,
  type FieldSnapshot,
  type LevelMaps,
  type ProgressReport,
  type ReceiverTrace,
  type RunOptions,
  type SimulationOptions,
  type SimulationResult,
  type StopReason,
} from "./simulation";
export { createKernelMemory, createWasmKernel, loadWasmKernelModule, wasmKernelProvider, wasmKernelSupported } from "./wasm/wasm-kernel";
