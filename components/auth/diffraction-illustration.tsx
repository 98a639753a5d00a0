/**
 * Wavefronts from a road source bending over a barrier into the shadow zone: the product in one
 * picture. Incident fronts are circles about the source, clipped to the lit zone; diffracted
 * fronts are circles about the barrier's top edge, lagging by the source-to-edge distance.
 */
const source = { x: 90, y: 290 };
const edge = { x: 250, y: 150 };
const sourceToEdge = Math.hypot(edge.x - source.x, edge.y - source.y);
const fronts = [60, 110, 160, 210, 260, 310, 360, 410, 460, 510];

export function DiffractionIllustration({ className = "" }: { className?: string }) {
  // The shadow boundary runs from the source over the edge; it meets the top of the picture here.
  const boundaryTopX = edge.x + (edge.y * (edge.x - source.x)) / (source.y - edge.y);
  return (
    <svg viewBox="0 0 600 360" className={className} aria-hidden>
      <defs>
        <clipPath id="illustration-lit">
          <path d={`M0 0H${boundaryTopX}L${edge.x} ${edge.y}V300H0Z`} />
        </clipPath>
        <clipPath id="illustration-shadow">
          <path d={`M${edge.x + 6} ${edge.y}L${boundaryTopX} 0H600V300H${edge.x + 6}Z`} />
        </clipPath>
      </defs>
      <line x1="0" y1="300" x2="600" y2="300" stroke="#3d5665" strokeWidth="2" />
      <g clipPath="url(#illustration-lit)" fill="none" stroke="#7cc3bd" strokeWidth="2">
        {fronts.map((r, i) => (
          <circle key={r} cx={source.x} cy={source.y} r={r} opacity={0.9 - i * 0.07} />
        ))}
      </g>
      <g clipPath="url(#illustration-shadow)" fill="none" stroke="#d65a2c" strokeWidth="2" strokeDasharray="3 6" strokeLinecap="round">
        {fronts
          .filter((r) => r > sourceToEdge)
          .map((r, i) => (
            <circle key={r} cx={edge.x} cy={edge.y} r={r - sourceToEdge} opacity={0.9 - i * 0.12} />
          ))}
      </g>
      <line x1={source.x} y1={source.y} x2={boundaryTopX} y2={0} stroke="#ffffff" strokeOpacity="0.12" strokeDasharray="2 5" />
      <rect x={edge.x - 6} y={edge.y} width="12" height={300 - edge.y} rx="2" fill="#e8e4da" />
      <circle cx={source.x} cy={source.y} r="6" fill="#fadccd" />
      <rect x="470" y="272" width="10" height="10" transform="rotate(45 475 277)" fill="#fadccd" />
    </svg>
  );
}
