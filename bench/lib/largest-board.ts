/**
 * The largest board the export caps allow (src/lib/export/export-limits.ts): 16 strings, 36 frets,
 * 5 m scale and 500 mm spacing. Export benches send it to find the heaviest work a visitor can ask for.
 */
export const LARGEST_BOARD = {
  name: 'Bench: largest board',
  units: 'mm',
  strings: 16,
  frets: 36,
  scale: { treble: 5000, bass: 5000 },
  perpendicularFret: 0,
  stringSpacing: { nut: 500, bridge: 500 },
  temperament: { kind: 'equal', divisions: 12 },
};
