/**
 * Boards: the shop's saved designs. Request and response shapes shared by the API routes, the
 * database layer and the Boards island. The geometry itself is always a design (./design.ts).
 */
import { z } from 'zod';

export const INSTRUMENT_TYPES = ['guitar', 'classical', 'bass', 'mandolin', 'ukulele', 'banjo', 'other'] as const;
export type InstrumentType = (typeof INSTRUMENT_TYPES)[number];

/**
 * A board's stored status, worked out from its proofs and its working copy (boardApproval() in
 * lib/proofs); the database's enum is made from this list. "changed_since_approval": the client
 * approved a revision and the board no longer matches it.
 */
export const STORED_BOARD_STATUSES = ['draft', 'shared', 'approved', 'changes_requested', 'changed_since_approval'] as const;
export type StoredBoardStatus = (typeof STORED_BOARD_STATUSES)[number];

/** Why a revision was made: a person saved one, or it was made for a proof, an export, a restore, an import, or it predates checkpoints. */
export const REVISION_REASONS = ['saved', 'created', 'proof', 'export', 'imported', 'restored', 'autosave'] as const;
export type RevisionReason = (typeof REVISION_REASONS)[number];

/** What the API shows as a board's status: the stored status, or "archived" once archived. */
export const BOARD_STATUSES = [...STORED_BOARD_STATUSES, 'archived'] as const;
export type BoardStatus = (typeof BOARD_STATUSES)[number];

/** List filter: one status, "active" (everything not archived, the default) or "all". */
export const BOARD_STATUS_FILTERS = ['active', 'all', ...BOARD_STATUSES] as const;
export type BoardStatusFilter = (typeof BOARD_STATUS_FILTERS)[number];

export const BOARD_SORTS = ['updated', 'name', 'scale'] as const;
export type BoardSort = (typeof BOARD_SORTS)[number];

export const MAX_PAGE_SIZE = 100;
/** Largest design JSON file accepted by the import (and by create/update bodies). */
export const BOARD_FILE_MAX_BYTES = 256 * 1024;
export const NOTE_MAX_CHARS = 500;

const clientName = z.string().trim().max(120, { message: 'must be at most 120 characters' });
const note = z.string().trim().max(NOTE_MAX_CHARS, { message: `must be at most ${NOTE_MAX_CHARS} characters` });
const version = z.number().int({ message: 'must be a whole number' }).positive({ message: 'must be at least 1' });

/**
 * Board fields outside the geometry. The `design` itself stays `unknown` here and is checked with
 * validateDesign so its issues carry the design's own field paths (prefixed with "design.").
 */
export const boardCreateSchema = z
  .object({
    design: z.unknown(),
    instrumentType: z.enum(INSTRUMENT_TYPES).default('guitar'),
    clientName: clientName.default(''),
    note: note.default(''),
  })
  .strict();
export type BoardCreate = z.infer<typeof boardCreateSchema>;

/** An update names the version the client last saw; any field left out stays as it is. */
export const boardUpdateSchema = z
  .object({
    version,
    design: z.unknown().optional(),
    instrumentType: z.enum(INSTRUMENT_TYPES).optional(),
    clientName: clientName.optional(),
    note: note.default(''),
    /** Keep the result as a revision too (a checkpoint with `note`); autosave leaves it out. */
    saveRevision: z.boolean().optional(),
    /** Sent after the builder has seen that this change moves the board off the approved layout. */
    confirmApprovalChange: z.boolean().optional(),
  })
  .strict();
export type BoardUpdate = z.infer<typeof boardUpdateSchema>;

export const boardRestoreSchema = z
  .object({
    revision: z.number().int({ message: 'must be a whole number' }).positive(),
    version,
    confirmApprovalChange: z.boolean().optional(),
  })
  .strict();

/** POST /api/boards/{id}/revisions: keep the working copy as a revision, with an optional note. */
export const boardSaveRevisionSchema = z.object({ version: version.optional(), note: note.default('') }).strict();

export const boardArchiveSchema = z.object({ archived: z.boolean(), version: version.optional() }).strict();

const pageNumber = z.coerce.number({ message: 'must be a number' }).int({ message: 'must be a whole number' });

/** GET /api/boards query string; also the Boards page's URL state. */
export const boardListQuerySchema = z
  .object({
    q: z.string().trim().max(120).default(''),
    status: z.enum(BOARD_STATUS_FILTERS).default('active'),
    instrument: z.enum(INSTRUMENT_TYPES).optional(),
    units: z.enum(['mm', 'in']).optional(),
    sort: z.enum(BOARD_SORTS).default('updated'),
    dir: z.enum(['asc', 'desc']).optional(),
    page: pageNumber.min(1, { message: 'must be at least 1' }).default(1),
    pageSize: pageNumber
      .min(1, { message: 'must be at least 1' })
      .max(MAX_PAGE_SIZE, { message: `must be at most ${MAX_PAGE_SIZE}` })
      .default(25),
  })
  .strict();
export type BoardListQuery = z.infer<typeof boardListQuerySchema>;

/** Newest first for "updated", A to Z / shortest first otherwise. */
export function defaultDirection(sort: BoardSort): 'asc' | 'desc' {
  return sort === 'updated' ? 'desc' : 'asc';
}

/** One row of the Boards list. Scale lengths are in millimetres whatever the design's units. */
export interface BoardSummary {
  id: number;
  name: string;
  instrumentType: string;
  clientName: string;
  units: 'mm' | 'in';
  status: BoardStatus;
  trebleScaleMm: number;
  bassScaleMm: number;
  /** The newest revision's number. */
  currentRevision: number;
  /** The revision the working copy equals; null while it has changes not yet in a revision. */
  workingRevision: number | null;
  /** The working copy's fingerprint (designFingerprint). */
  fingerprint: string;
  /** The client's standing approval, if any: which revision, which layout. */
  approval: { revision: number; fingerprint: string } | null;
  version: number;
  updatedAt: string;
  createdAt: string;
}

export interface BoardList {
  items: BoardSummary[];
  total: number;
  page: number;
  pageSize: number;
}

/**
 * A board with its working copy (`revision` = the revision it equals, null while it has changes
 * not yet in one), or with one revision's design when asked (`fingerprint` is then that revision's).
 */
export interface BoardDetail extends BoardSummary {
  revision: number | null;
  design: unknown;
}

export interface BoardRevision {
  revision: number;
  note: string;
  reason: RevisionReason;
  fingerprint: string;
  authorName: string;
  createdAt: string;
  design: unknown;
}

/** The JSON file Boards exports; the import also accepts a bare design (a file without `kind`). */
export const BOARD_FILE_KIND = 'kerfline-board';

export const boardFileSchema = z
  .object({
    kind: z.literal(BOARD_FILE_KIND),
    instrumentType: z.enum(INSTRUMENT_TYPES).default('guitar'),
    clientName: clientName.default(''),
    design: z.unknown(),
  })
  .passthrough();
export type BoardFile = z.infer<typeof boardFileSchema>;
