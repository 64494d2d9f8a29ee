/**
 * The cautions that travel with every export, in one place so the download panel, the files and
 * the documentation say the same thing.
 */

/** Printed on every page of the paper template. */
export const PRINT_CAUTION = 'Print at 100 % / actual size. Measure both bars before cutting.';

/** For every machine export (slot paths, G-code, index template; DXF, SVG and PDF) and beside the download buttons. */
export const MACHINE_SAFETY_NOTES: readonly string[] = [
  'Verify units and scale on scrap or a test piece before cutting the good blank.',
  'Secure the work: clamp the blank or template; never hold small parts by hand at a blade or cutter.',
  'Wear eye and hearing protection.',
  'Never leave a running machine.',
  "Follow the machine maker's instructions and your local workshop rules; they come first.",
];

/** For files a machine runs as they are (G-code): said before the notes above. */
export const DRY_RUN_NOTE = 'Run a dry run first (every Z raised so the cutter cuts only air), then check the zero, the tool and the depth before the real cut.';

/** One line for a file comment, naming what the file is and the units it is drawn in. */
export function machineCaution(units: 'mm' | 'in', what: 'slot paths' | 'index template' | 'slot toolpath'): string {
  const unitName = units === 'mm' ? 'millimetres' : 'inches';
  return `Kerfline ${what}. Units: ${unitName} (${units}), drawn 1:1. CAUTION: ${MACHINE_SAFETY_NOTES.join(' ')}`;
}
