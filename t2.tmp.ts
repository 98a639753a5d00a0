import { Simulation } from "@/lib/fdtd/simulation";
const scene = { version: 1, domain: { width: 6, height: 6 }, resolution: { kind: "cellSize", cellSize: 0.01 },
  sources: [{ id: "s", label: "s", position: { x: 3.005, y: 3.005 }, signal: { kind: "ricker", peakFrequency: 1715 } }],
  receivers: [{ id: "r", label: "r", position: { x: 3.505, y: 3.005 } }],
  duration: { kind: "time", seconds: 0.004 } };
const t0 = performance.now();
const sim = new Simulation(scene);
console.log(sim.grid.nx, sim.grid.ny, sim.grid.steps, sim.grid.timeStep, sim.grid.warnings);
const res = sim.run();
console.log("ms", performance.now()-t0, res.timings);
const p = res.receivers[0]!.pressure; let mx=0, at=0; for (let k=0;k<p.length;k++) if (Math.abs(p[k]!)>mx){mx=Math.abs(p[k]!);at=k;}
console.log("peak", mx, "at", at, at*res.grid.timeStep, "expected", 0.5/343 + 1.5/1715, res.energy.slice(-3));
