import { describe, expect, it } from 'vitest';
import { BoardRequestError } from '~/components/boards/board-requests.ts';
import { boardStore, type BoardRequests } from '~/components/editor/design-store.ts';
import { DEMO_DESIGNS } from '~/lib/boards/demo/demo-designs.ts';
import type { BoardDetail } from '~/lib/schemas/board.ts';
import type { Design } from '~/lib/schemas/design.ts';

const design = DEMO_DESIGNS[0]!.design;

function boardOf(d: Design, version: number): BoardDetail {
  return {
    id: 7,
    name: d.name,
    instrumentType: 'guitar',
    clientName: '',
    units: d.units,
    status: 'draft',
    trebleScaleMm: d.scale.treble,
    bassScaleMm: d.scale.bass,
    currentRevision: version,
    workingRevision: version,
    fingerprint: '',
    approval: null,
    version,
    updatedAt: '2026-01-01T00:00:00.000Z',
    createdAt: '2026-01-01T00:00:00.000Z',
    revision: version,
    design: d,
  };
}

/** A server holding one board: saves over a stale version answer 409 with the board as it is. */
function fakeServer(start: BoardDetail) {
  let current = start;
  const saves: number[] = [];
  const requests: BoardRequests = {
    fetchBoard: async (id) => {
      if (id !== current.id) throw new BoardRequestError(404, 'No such board in your shop', {});
      return current;
    },
    saveBoard: async (id, version, d) => {
      saves.push(version);
      if (id !== current.id) throw new BoardRequestError(404, 'No such board in your shop', {});
      if (version !== current.version) throw new BoardRequestError(409, 'changed', { currentVersion: current.version, current });
      current = boardOf(d as Design, version + 1);
      return current;
    },
  };
  return { requests, saves, current: () => current };
}

describe('board design store (Boards API behind the editor)', () => {
  it('loads the current revision and saves over the version last seen', async () => {
    const server = fakeServer(boardOf(design, 1));
    const store = boardStore(7, server.requests);
    expect(await store.load()).toEqual(design);
    const changed = { ...design, perpendicularFret: 7 };
    const saved = await store.save(changed, 1);
    expect(saved.state).toBe('saved');
    expect(saved.state === 'saved' && saved.board?.version).toBe(2);
    expect(server.current().design).toEqual(changed);
  });

  it('reports a stale version as a conflict carrying the board as it now is, and writes nothing', async () => {
    const server = fakeServer(boardOf(design, 3));
    const store = boardStore(7, server.requests);
    const result = await store.save({ ...design, frets: 22 }, 2);
    expect(result).toMatchObject({ state: 'conflict', current: { version: 3, design } });
    expect(server.current().version).toBe(3);
  });

  it('turns other failures into an error status (never a throw), and needs a version to save', async () => {
    const store = boardStore(8, fakeServer(boardOf(design, 1)).requests);
    expect(await store.save(design, 1)).toEqual({ state: 'error', message: 'No such board in your shop' });
    expect(await store.load()).toBeNull();
    expect((await store.save(design)).state).toBe('error');
    const offline = boardStore(7, {
      fetchBoard: () => Promise.reject(new TypeError('Failed to fetch')),
      saveBoard: () => Promise.reject(new TypeError('Failed to fetch')),
    });
    expect(await offline.save(design, 1)).toMatchObject({ state: 'error', message: expect.stringContaining('your edit is kept') });
  });
});
