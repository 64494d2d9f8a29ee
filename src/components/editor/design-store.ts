/**
 * Where the editor keeps its design. The Layout screen works without an account: the design is a
 * scratch copy in this browser's local storage. Saving to the shop's Boards adds another kind of
 * storage here (e.g. `{ kind: 'board', designId }`) with its own DesignStore; the editor only
 * talks to this interface and shows `place` and the last save's status in its toolbar.
 */
import { validateDesign, type Design } from '~/lib/schemas/design';

export type DesignStorage = { kind: 'scratch' };

export type SaveStatus =
  | { state: 'idle' }
  | { state: 'saving' }
  | { state: 'saved'; at: Date }
  | { state: 'error'; message: string };

export interface DesignStore {
  /** Short description of where the design is kept, shown in the toolbar. */
  readonly place: string;
  /** The kept design, or null when there is none (or it no longer validates). */
  load(): Promise<Design | null>;
  /** Keeps a valid design; never throws, failures come back as an error status. */
  save(design: Design): Promise<SaveStatus>;
}

export const SCRATCH_STORAGE_KEY = 'kerfline.scratchDesign';

export function createDesignStore(storage: DesignStorage): DesignStore {
  switch (storage.kind) {
    case 'scratch':
      return scratchStore(globalThis.localStorage);
  }
}

/** The scratch design in local storage (or any Storage, for tests). */
export function scratchStore(storage: Pick<Storage, 'getItem' | 'setItem'> | undefined): DesignStore {
  return {
    place: 'Scratch design, kept in this browser only',
    async load() {
      const text = storage?.getItem(SCRATCH_STORAGE_KEY);
      if (!text) return null;
      try {
        const validation = validateDesign(JSON.parse(text));
        return validation.ok ? validation.design : null;
      } catch {
        return null;
      }
    },
    async save(design) {
      if (!storage) return { state: 'error', message: 'this browser does not keep local data' };
      try {
        storage.setItem(SCRATCH_STORAGE_KEY, JSON.stringify(design));
        return { state: 'saved', at: new Date() };
      } catch (error) {
        return { state: 'error', message: `could not keep the design in this browser (${String(error)})` };
      }
    },
  };
}
