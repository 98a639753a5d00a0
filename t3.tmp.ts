import { Simulation } from "@/lib/fdtd/simulation";
for (const [pml, levels] of [[true,true],[true,false],[false,false],[false,true]] as const) {
const edge = pml ? { kind: "pml" } : { kind: "rigid" };
const scene = { version: 1, domain: { width: 6, height: 6 }, resolution: { kind: "cellSize", cellSize: 0.01 },
  boundary: { left: edge, right: edge, top: edge, bottom: edge }, output: { levelMaps: levels },
  sources: [{ id: "s", label: "s", position: { x: 3.005, y: 3.005 }, signal: { kind: "ricker", peakFrequency: 1715 } }],
  duration: { kind: "time", seconds: 0.004 } };
const sim = new Simulation(scene);
const res = sim.run();
console.log(pml, levels, (res.timings.cellUpdatesPerSecond/1e6).toFixed(1));
}
