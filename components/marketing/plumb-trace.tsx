// The plumb-line motif: a bar trace drawn over a clip frame against the vertical through its start point,
// so drift reads as distance from the line. Eccentric in slate, concentric in teal, as everywhere in Plumbline.
export function PlumbTrace({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 220 260" className={className} role="img" aria-labelledby="plumb-trace-title">
      <title id="plumb-trace-title">A bar path drifting away from a plumb line through its start point</title>
      <rect x="1" y="1" width="218" height="258" rx="10" className="fill-sunken stroke-line" strokeWidth="1" />
      <line x1="96" y1="14" x2="96" y2="222" className="stroke-ink" strokeWidth="1" />
      <rect x="91" y="222" width="10" height="4" rx="1" className="fill-ink" />
      <path d="M89 227h14l-7 17z" className="fill-ink" />
      <circle cx="96" cy="44" r="18" className="stroke-ink-faint" strokeWidth="1" strokeDasharray="3 3" fill="none" />
      <path
        d="M96 44 C 98 90, 110 150, 114 196"
        className="stroke-phase-eccentric"
        strokeWidth="3.5"
        strokeLinecap="round"
        fill="none"
      />
      <path
        d="M114 196 C 120 160, 124 126, 118 98 C 113 74, 102 54, 97 44"
        className="stroke-phase-concentric"
        strokeWidth="3.5"
        strokeLinecap="round"
        fill="none"
      />
      <circle cx="96" cy="44" r="4" className="fill-surface stroke-ink" strokeWidth="1.5" />
      <g className="stroke-ink" strokeWidth="1">
        <line x1="96" y1="130" x2="122.4" y2="130" />
        <line x1="122.4" y1="125" x2="122.4" y2="135" />
      </g>
      <text x="130" y="134" className="nums fill-ink" fontSize="13" fontWeight="600">
        2.4
        <tspan className="fill-ink-muted" fontWeight="300">
          {" "}
          cm
        </tspan>
      </text>
      <text x="130" y="148" className="fill-ink-muted" fontSize="10">
        bar drift
      </text>
      <g fontSize="10" className="fill-ink-muted">
        <rect x="14" y="232" width="8" height="3" rx="1.5" className="fill-phase-eccentric" />
        <text x="26" y="236">lowering</text>
        <rect x="14" y="244" width="8" height="3" rx="1.5" className="fill-phase-concentric" />
        <text x="26" y="248">lifting</text>
      </g>
    </svg>
  );
}
