import { Simulation } from "@/lib/fdtd/simulation";
// source at (1, 1), receiver toward the right PML; reference: domain large enough.
function trace(width: number, height: number, sx: number, sy: number, rx: number, ry: number, secs: number, cells = 20) {
  const scene = { version: 1, domain: { width, height }, resolution: { kind: "cellSize", cellSize: 0.01 },
    boundary: { left: { kind: "pml", layerCells: cells }, right: { kind: "pml", layerCells: cells }, top: { kind: "pml", layerCells: cells }, bottom: { kind: "pml", layerCells: cells } }, output: { levelMaps: false },
    sources: [{ id: "s", label: "s", position: { x: sx, y: sy }, signal: { kind: "ricker", peakFrequency: 343/0.01/15 } }],
    receivers: [{ id: "r", label: "r", position: { x: rx, y: ry } }],
    duration: { kind: "time", seconds: secs } };
  return new Simulation(scene).run().receivers[0]!.pressure;
}
const secs = 0.0035;
for (const cells of [10, 20]) {
// normal incidence: domain 1.0 wide, source 0.505 from left... receiver at 0.805, PML at 1.0
const a = trace(1.0, 2.0, 0.305, 1.005, 0.805, 1.005, secs, cells);
const b = trace(3.0, 2.0, 0.305, 1.005, 0.805, 1.005, secs, cells);
let inc = 0, refl = 0; for (let k = 0; k < a.length; k++) { inc = Math.max(inc, Math.abs(b[k]!)); refl = Math.max(refl, Math.abs(a[k]! - b[k]!)); }
console.log(cells, "normal", (20*Math.log10(refl/inc)).toFixed(1), "dB");
// 45 degrees: source (0.505,0.505) receiver (0.805,0.805) near top-right corner? use receiver mirrored path: source (0.3,0.3) receiver (0.7,0.3) wall at top y=0.6? 
const c = trace(2.0, 0.8, 0.705, 0.305, 1.205, 0.305, secs, cells); // reflection from top PML at y=0.8 : path 45deg if dx=0.5,  2*(0.8-0.305)=0.99 -> ~ 63deg. 
const d = trace(2.0, 3.0, 0.705, 0.305, 1.205, 0.305, secs, cells);
inc = 0; refl = 0; for (let k = 0; k < c.length; k++) { inc = Math.max(inc, Math.abs(d[k]!)); refl = Math.max(refl, Math.abs(c[k]! - d[k]!)); }
console.log(cells, "oblique", (20*Math.log10(refl/inc)).toFixed(1), "dB");
}
