import { describe, expect, it } from 'vitest';
import { boardFile, readBoardFile } from '~/lib/boards/board-file.ts';
import { exportFileName } from '~/lib/export/file-name.ts';
import { scaleText } from '~/components/boards/board-labels.ts';
import type { BoardDetail } from '~/lib/schemas/board.ts';

const detail: BoardDetail & { revision: number } = {
  id: 7, name: 'Demo: seven-string', instrumentType: 'guitar', clientName: 'Ines Calloway', units: 'mm', status: 'draft',
  trebleScaleMm: 648, bassScaleMm: 686, currentRevision: 2, workingRevision: 2, fingerprint: '0000-0000-0000', approval: null, version: 3, updatedAt: '', createdAt: '', revision: 2, design: { name: 'x' },
};

describe('board JSON file', () => {
  it('reads back what it writes (envelope), with design issues to be reported under "design"', () => {
    const read = readBoardFile(JSON.parse(JSON.stringify(boardFile(detail))));
    expect(read).toMatchObject({ ok: true, designPrefix: 'design', file: { instrumentType: 'guitar', clientName: 'Ines Calloway', design: { name: 'x' } } });
  });

  it('takes a file without "kind" as a bare design', () => {
    expect(readBoardFile({ name: 'y' })).toMatchObject({ ok: true, designPrefix: '', file: { design: { name: 'y' } } });
  });

  it('names the bad envelope field', () => {
    const read = readBoardFile({ kind: 'kerfline-board', instrumentType: 'lute', design: {} });
    expect(read).toMatchObject({ ok: false, issues: [{ path: 'instrumentType' }] });
  });

  it('makes file names of letters, digits and dashes', () => {
    expect(exportFileName('Demo: seven-string, 648/686 mm', { kind: 'board-file', revision: 3 })).toBe('demo-seven-string-648-686-mm-r3-board.json');
    expect(exportFileName('***', { kind: 'board-file', revision: 1 })).toBe('design-r1-board.json');
  });

  it('shows one scale or a treble–bass range in the design units (0.01 mm, 0.001 in)', () => {
    expect(scaleText({ trebleScaleMm: 648, bassScaleMm: 686, units: 'mm' })).toBe('648.00–686.00 mm');
    expect(scaleText({ trebleScaleMm: 431.8, bassScaleMm: 431.8, units: 'in' })).toBe('17.000 in');
  });
});
