/** Wavefronts from a road source bending over a barrier into the shadow zone: the product in one picture. */
export function DiffractionIllustration({ className = "" }: { className?: string }) {
  const fronts = [60, 110, 160, 210, 260, 310, 360];
  return (
    <svg viewBox="0 0 600 360" className={className} aria-hidden>
      <defs>
        <clipPath id="lit">
          <path d="M0 0H600V300H250V150Z" />
        </clipPath>
        <clipPath id="shadow">
          <path d="M250 150L600 -20V300H250Z" />
        </clipPath>
      </defs>
      <line x1="0" y1="300" x2="600" y2="300" stroke="#3d5665" strokeWidth="2" />
      <g clipPath="url(#lit)" fill="none" stroke="#7cc3bd" strokeWidth="2">
        {fronts.map((r, i) => (
          <circle key={r} cx="90" cy="290" r={r} opacity={0.85 - i * 0.1} />
        ))}
      </g>
      <g fill="none" stroke="#d65a2c" strokeWidth="2" strokeDasharray="2 6" strokeLinecap="round">
        {fronts.slice(2).map((r, i) => (
          <path key={r} d={`M250 ${150 + (r - 160) * 0.95} A ${r - 150} ${r - 150} 0 0 0 ${250 + (r - 150)} 300`} opacity={0.9 - i * 0.15} />
        ))}
      </g>
      <rect x="244" y="150" width="12" height="150" rx="2" fill="#e8e4da" />
      <circle cx="90" cy="290" r="6" fill="#fadccd" />
      <g fill="#fadccd">
        <rect x="470" y="272" width="10" height="10" transform="rotate(45 475 277)" />
      </g>
    </svg>
  );
}
