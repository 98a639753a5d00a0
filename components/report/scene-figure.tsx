// The frozen scene of a run, drawn to scale as a vector figure for screen and paper: the domain with
// its absorbing layers (PML) and reflecting sides, solids, walls, treated surfaces, sources, receivers
// and receiver lines, with axes in metres. SVG rather than canvas, so the printed page stays sharp.
import { pmlBandWidths } from "@/components/scene-editor/model/scene-extent";
import type { Scene, SurfaceTreatment } from "@/lib/fdtd/scene";
import { axisTicks } from "./model/axis-ticks";

const colours = {
  domain: "#fbfaf7",
  pml: "#e3efed",
  pmlEdge: "#7cc3bd",
  rigid: "#16212b",
  solid: "#5a6670",
  wall: "#2c3a45",
  treated: "#d65a2c",
  source: "#d65a2c",
  receiver: "#127673",
  axis: "#66717c",
  grid: "#efede6",
};

const treated = (surface: SurfaceTreatment) => surface.kind !== "rigid";

/** Plot width in SVG units; the figure scales to its container. */
const PLOT_WIDTH = 680;
const MARGIN = { left: 44, right: 12, top: 12, bottom: 36 };

export function SceneFigure({ scene, cellSize }: { scene: Scene; cellSize: number }) {
  const bands = pmlBandWidths(scene, cellSize);
  const { width, height } = scene.domain;
  const minX = -bands.left;
  const maxX = width + bands.right;
  const minY = -bands.bottom;
  const maxY = height + bands.top;
  const scale = PLOT_WIDTH / (maxX - minX);
  const plotHeight = (maxY - minY) * scale;
  const sx = (x: number) => MARGIN.left + (x - minX) * scale;
  const sy = (y: number) => MARGIN.top + (maxY - y) * scale;
  const points = (list: { x: number; y: number }[]) => list.map((p) => `${sx(p.x).toFixed(2)},${sy(p.y).toFixed(2)}`).join(" ");
  const xTicks = axisTicks(minX, maxX, 10).ticks;
  const yTicks = axisTicks(minY, maxY, Math.max(2, Math.round((plotHeight / PLOT_WIDTH) * 10))).ticks;
  const totalWidth = MARGIN.left + PLOT_WIDTH + MARGIN.right;
  const totalHeight = MARGIN.top + plotHeight + MARGIN.bottom;
  const marker = Math.max(4, Math.min(7, PLOT_WIDTH / 110));
  const sides = [
    { side: "left", x1: 0, y1: 0, x2: 0, y2: height },
    { side: "right", x1: width, y1: 0, x2: width, y2: height },
    { side: "bottom", x1: 0, y1: 0, x2: width, y2: 0 },
    { side: "top", x1: 0, y1: height, x2: width, y2: height },
  ] as const;

  return (
    <svg viewBox={`0 0 ${totalWidth} ${totalHeight}`} className="h-auto w-full" role="img" aria-label={`Section of ${scene.name || "the scene"}, ${width} m by ${height} m, to scale`} fontFamily="inherit">
      <rect x={sx(minX)} y={sy(maxY)} width={(maxX - minX) * scale} height={plotHeight} fill={colours.pml} />
      <rect x={sx(0)} y={sy(height)} width={width * scale} height={height * scale} fill={colours.domain} stroke={colours.pmlEdge} strokeDasharray="4 3" strokeWidth={0.8} />
      {xTicks.map((x) => (
        <line key={`gx${x}`} x1={sx(x)} x2={sx(x)} y1={sy(maxY)} y2={sy(minY)} stroke={colours.grid} strokeWidth={0.6} />
      ))}
      {yTicks.map((y) => (
        <line key={`gy${y}`} x1={sx(minX)} x2={sx(maxX)} y1={sy(y)} y2={sy(y)} stroke={colours.grid} strokeWidth={0.6} />
      ))}
      {sides.map((edge) =>
        scene.boundary[edge.side].kind === "pml" ? null : (
          <line key={edge.side} x1={sx(edge.x1)} y1={sy(edge.y1)} x2={sx(edge.x2)} y2={sy(edge.y2)} stroke={treated(scene.boundary[edge.side] as SurfaceTreatment) ? colours.treated : colours.rigid} strokeWidth={2.5} />
        ),
      )}
      {scene.geometry.solids.map((solid) => (
        <polygon key={solid.id} points={points(solid.polygon)} fill={colours.solid} fillOpacity={0.85} stroke={treated(solid.surface) ? colours.treated : colours.solid} strokeWidth={1.2}>
          <title>{solid.label || solid.id}</title>
        </polygon>
      ))}
      {scene.geometry.walls.map((wall) => (
        <polyline key={wall.id} points={points(wall.path)} fill="none" stroke={treated(wall.surface) ? colours.treated : colours.wall} strokeWidth={Math.max(2, wall.thickness * scale)} strokeLinecap="square">
          <title>{wall.label || wall.id}</title>
        </polyline>
      ))}
      {scene.geometry.surfaces.map((surface) => (
        <polyline key={surface.id} points={points(surface.path)} fill="none" stroke={colours.treated} strokeWidth={2} strokeDasharray="6 3">
          <title>{surface.label || surface.id}</title>
        </polyline>
      ))}
      {scene.receiverLines.map((line) => (
        <g key={line.id}>
          <line x1={sx(line.from.x)} y1={sy(line.from.y)} x2={sx(line.to.x)} y2={sy(line.to.y)} stroke={colours.receiver} strokeWidth={1} strokeDasharray="2 3" />
          {Array.from({ length: Math.min(line.count, 200) }, (_, k) => {
            const t = line.count > 1 ? k / (line.count - 1) : 0;
            return <circle key={k} cx={sx(line.from.x + t * (line.to.x - line.from.x))} cy={sy(line.from.y + t * (line.to.y - line.from.y))} r={1.6} fill={colours.receiver} />;
          })}
        </g>
      ))}
      {scene.receivers.map((receiver) => {
        const x = sx(receiver.position.x);
        const y = sy(receiver.position.y);
        return (
          <g key={receiver.id}>
            <polygon points={`${x},${y - marker} ${x + marker * 0.87},${y + marker * 0.5} ${x - marker * 0.87},${y + marker * 0.5}`} fill={colours.receiver} />
            <text x={x + marker + 2} y={y - 2} fontSize={9} fill={colours.receiver}>
              {receiver.label || receiver.id}
            </text>
          </g>
        );
      })}
      {scene.sources.map((source) => (
        <g key={source.id}>
          <circle cx={sx(source.position.x)} cy={sy(source.position.y)} r={marker * 0.75} fill={colours.source} />
          <text x={sx(source.position.x) + marker + 2} y={sy(source.position.y) - 3} fontSize={9} fill={colours.source}>
            {source.label || source.id}
          </text>
        </g>
      ))}
      <g fontSize={9} fill={colours.axis}>
        <line x1={sx(minX)} x2={sx(maxX)} y1={sy(minY)} y2={sy(minY)} stroke={colours.axis} strokeWidth={0.8} />
        <line x1={sx(minX)} x2={sx(minX)} y1={sy(maxY)} y2={sy(minY)} stroke={colours.axis} strokeWidth={0.8} />
        {xTicks.map((x) => (
          <g key={`tx${x}`}>
            <line x1={sx(x)} x2={sx(x)} y1={sy(minY)} y2={sy(minY) + 4} stroke={colours.axis} strokeWidth={0.8} />
            <text x={sx(x)} y={sy(minY) + 14} textAnchor="middle">
              {x}
            </text>
          </g>
        ))}
        {yTicks.map((y) => (
          <g key={`ty${y}`}>
            <line x1={sx(minX) - 4} x2={sx(minX)} y1={sy(y)} y2={sy(y)} stroke={colours.axis} strokeWidth={0.8} />
            <text x={sx(minX) - 6} y={sy(y) + 3} textAnchor="end">
              {y}
            </text>
          </g>
        ))}
        <text x={MARGIN.left + PLOT_WIDTH / 2} y={totalHeight - 4} textAnchor="middle">
          x (m)
        </text>
        <text x={10} y={MARGIN.top + plotHeight / 2} textAnchor="middle" transform={`rotate(-90 10 ${MARGIN.top + plotHeight / 2})`}>
          y (m)
        </text>
      </g>
    </svg>
  );
}

/** The figure's key, as HTML beside it (it reflows on narrow pages and prints crisply). */
export function SceneFigureKey() {
  const item = (swatch: React.ReactNode, text: string) => (
    <li className="flex items-center gap-1.5">
      <svg viewBox="0 0 16 10" className="h-2.5 w-4" aria-hidden>
        {swatch}
      </svg>
      {text}
    </li>
  );
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-1 text-[12px] text-muted">
      {item(<rect width="16" height="10" fill={colours.pml} stroke={colours.pmlEdge} />, "absorbing layer (PML)")}
      {item(<rect width="16" height="10" fill={colours.solid} />, "solid")}
      {item(<line x1="0" y1="5" x2="16" y2="5" stroke={colours.wall} strokeWidth="3" />, "wall or rigid side")}
      {item(<line x1="0" y1="5" x2="16" y2="5" stroke={colours.treated} strokeWidth="2" strokeDasharray="4 2" />, "treated surface")}
      {item(<circle cx="8" cy="5" r="4" fill={colours.source} />, "source")}
      {item(<polygon points="8,1 12,9 4,9" fill={colours.receiver} />, "receiver")}
    </ul>
  );
}
