/** The Wavesieve mark: a travelling wave crossing a grid of sieve bars, one crest kept whole. */
export function LogoMark({ size = 28 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <rect x="1" y="1" width="30" height="30" rx="7" fill="#0e1b26" />
      <g stroke="#4a6275" strokeWidth="1.2">
        <line x1="9" y1="6" x2="9" y2="26" />
        <line x1="16" y1="6" x2="16" y2="26" />
        <line x1="23" y1="6" x2="23" y2="26" />
      </g>
      <path d="M3 19 C 7 19, 9 19, 11 16 S 14 8, 16 8 S 19 14, 21 16 S 25 19, 29 19" fill="none" stroke="#5fc4cf" strokeWidth="2.4" strokeLinecap="round" />
      <circle cx="16" cy="8" r="2" fill="#e0a43a" />
    </svg>
  );
}
