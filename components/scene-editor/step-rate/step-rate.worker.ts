// Measures this computer's stepping rate off the main thread and posts it back once.
import { measureStepRate } from "./measure-step-rate";

self.postMessage(measureStepRate());
