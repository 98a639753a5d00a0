// A small, true-to-scale drawing of a scene for lists and cards: domain, PML bands, solids,
// walls, treated surfaces, sources and receivers. Scene y points up; SVG y points down.
import type { Scene, SurfaceTreatment } from "@/lib/fdtd/scene";

const colours = {
  domain: "#fbfaf7",
  pml: "#e6efee",
  solid: "#5a6670",
  wall: "#2c3a45",
  treated: "#d65a2c",
  source: "#d65a2c",
  receiver: "#127673",
};

function isTreated(surface: SurfaceTreatment): boolean {
  return surface.kind !== "rigid";
}

export function SceneSketch({ scene, className = "" }: { scene: Scene; className?: string }) {
  const { width, height } = scene.domain;
  const pad = Math.max(width, height) * 0.04;
  const flip = (y: number) => height - y;
  const stroke = Math.max(width, height) / 300;
  const points = (list: { x: number; y: number }[]) => list.map((p) => `${p.x},${flip(p.y)}`).join(" ");
  const sides = scene.boundary;

  return (
    <svg
      viewBox={`${-pad} ${-pad} ${width + 2 * pad} ${height + 2 * pad}`}
      className={className}
      role="img"
      aria-label={`Sketch of ${scene.name || "the scene"}: ${width} by ${height} m`}
      preserveAspectRatio="xMidYMid meet"
    >
      <rect x={-pad} y={-pad} width={width + 2 * pad} height={height + 2 * pad} fill={colours.pml} opacity={0.0} />
      {sides.left.kind === "pml" ? <rect x={-pad} y={-pad} width={pad} height={height + 2 * pad} fill={colours.pml} /> : null}
      {sides.right.kind === "pml" ? <rect x={width} y={-pad} width={pad} height={height + 2 * pad} fill={colours.pml} /> : null}
      {sides.top.kind === "pml" ? <rect x={-pad} y={-pad} width={width + 2 * pad} height={pad} fill={colours.pml} /> : null}
      {sides.bottom.kind === "pml" ? <rect x={-pad} y={height} width={width + 2 * pad} height={pad} fill={colours.pml} /> : null}
      <rect x={0} y={0} width={width} height={height} fill={colours.domain} stroke="#c9c5b8" strokeWidth={stroke} />
      {sides.bottom.kind !== "pml" ? <line x1={0} y1={height} x2={width} y2={height} stroke={colours.wall} strokeWidth={stroke * 2.5} /> : null}
      {sides.top.kind !== "pml" ? <line x1={0} y1={0} x2={width} y2={0} stroke={colours.wall} strokeWidth={stroke * 2.5} /> : null}
      {sides.left.kind !== "pml" ? <line x1={0} y1={0} x2={0} y2={height} stroke={colours.wall} strokeWidth={stroke * 2.5} /> : null}
      {sides.right.kind !== "pml" ? <line x1={width} y1={0} x2={width} y2={height} stroke={colours.wall} strokeWidth={stroke * 2.5} /> : null}

      {scene.geometry.solids.map((solid) => (
        <polygon
          key={solid.id}
          points={points(solid.polygon)}
          fill={colours.solid}
          fillOpacity={0.85}
          stroke={isTreated(solid.surface) ? colours.treated : colours.solid}
          strokeWidth={stroke}
        >
          <title>{solid.label || solid.id}</title>
        </polygon>
      ))}
      {scene.geometry.walls.map((wall) => (
        <polyline
          key={wall.id}
          points={points(wall.path)}
          fill="none"
          stroke={colours.wall}
          strokeWidth={Math.max(wall.thickness, stroke * 2.5)}
          strokeLinecap="square"
        >
          <title>{wall.label || wall.id}</title>
        </polyline>
      ))}
      {scene.geometry.surfaces.map((surface) => (
        <polyline
          key={surface.id}
          points={points(surface.path)}
          fill="none"
          stroke={colours.treated}
          strokeWidth={stroke * 2}
          strokeDasharray={`${stroke * 4} ${stroke * 3}`}
        >
          <title>{surface.label || surface.id}</title>
        </polyline>
      ))}
      {scene.receiverLines.map((line) => (
        <line
          key={line.id}
          x1={line.from.x}
          y1={flip(line.from.y)}
          x2={line.to.x}
          y2={flip(line.to.y)}
          stroke={colours.receiver}
          strokeWidth={stroke}
          strokeDasharray={`${stroke} ${stroke * 3}`}
        />
      ))}
      {scene.receivers.map((receiver) => {
        const s = Math.max(width, height) / 70;
        const { x } = receiver.position;
        const y = flip(receiver.position.y);
        return (
          <polygon key={receiver.id} points={`${x},${y - s} ${x + s * 0.87},${y + s * 0.5} ${x - s * 0.87},${y + s * 0.5}`} fill={colours.receiver}>
            <title>{receiver.label || receiver.id}</title>
          </polygon>
        );
      })}
      {scene.sources.map((source) => (
        <circle key={source.id} cx={source.position.x} cy={flip(source.position.y)} r={Math.max(width, height) / 90} fill={colours.source}>
          <title>{source.label || source.id}</title>
        </circle>
      ))}
    </svg>
  );
}
