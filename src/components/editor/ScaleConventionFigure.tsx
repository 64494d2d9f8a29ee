/**
 * A small figure beside the scale-convention choice: one slanted outer string from the nut to
 * the saddle, its length along the string (solid) and its run along the centre line (dashed).
 */
export function ScaleConventionFigure() {
  return (
    <svg viewBox="0 0 220 70" width="220" height="70" role="img" aria-label="Along the string: the slanted length from nut to saddle. Along the centre line: the same string's run, square to the nut." className="my-1 text-ink">
      <line x1="10" y1="60" x2="210" y2="60" stroke="currentColor" strokeDasharray="6 2 1 2" strokeWidth="0.8" />
      <text x="212" y="63" fontSize="8" fill="currentColor" textAnchor="end" dy="-4">centre line</text>
      <line x1="20" y1="8" x2="20" y2="64" stroke="currentColor" strokeWidth="2" />
      <text x="22" y="14" fontSize="8" fill="currentColor">nut</text>
      <line x1="196" y1="8" x2="196" y2="64" stroke="currentColor" strokeWidth="2" />
      <text x="194" y="14" fontSize="8" fill="currentColor" textAnchor="end">saddle</text>
      <line x1="20" y1="34" x2="196" y2="22" stroke="currentColor" strokeWidth="1.2" />
      <text x="108" y="24" fontSize="8" fill="currentColor" textAnchor="middle">along the string</text>
      <line x1="20" y1="50" x2="196" y2="50" stroke="currentColor" strokeWidth="1" strokeDasharray="3 2" />
      <text x="108" y="47" fontSize="8" fill="currentColor" textAnchor="middle">along the centre line</text>
    </svg>
  );
}
