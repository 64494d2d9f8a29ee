/**
 * One fret wire on a shop's list: its size and the stock length it comes in, in millimetres
 * (the list is the shop's, shared by boards in mm and in inches). One schema for the form, the
 * routes and the database layer.
 */
import { z } from 'zod';

export const WIRE_LIMITS = { nameMaxChars: 80, sourceMaxChars: 120, maxSizeMm: 20, maxStockMm: 5000 } as const;

const size = (what: string) =>
  z
    .number({ invalid_type_error: `${what} must be a number of millimetres`, required_error: 'is required' })
    .finite({ message: 'must be a finite number' })
    .positive({ message: 'must be greater than 0' })
    .max(WIRE_LIMITS.maxSizeMm, { message: `must be at most ${WIRE_LIMITS.maxSizeMm} mm` });

export const fretWireInputSchema = z
  .object({
    name: z.string({ required_error: 'is required' }).trim().min(1, { message: 'must not be empty' }).max(WIRE_LIMITS.nameMaxChars, { message: `must be at most ${WIRE_LIMITS.nameMaxChars} characters` }),
    crownWidthMm: size('the crown width'),
    crownHeightMm: size('the crown height'),
    tangWidthMm: size('the tang width'),
    tangDepthMm: size('the tang depth'),
    barbWidthMm: size('the barb width'),
    stockLengthMm: z
      .number({ invalid_type_error: 'must be a number of millimetres', required_error: 'is required' })
      .finite({ message: 'must be a finite number' })
      .positive({ message: 'must be greater than 0' })
      .max(WIRE_LIMITS.maxStockMm, { message: `must be at most ${WIRE_LIMITS.maxStockMm} mm` }),
    /** Where the sizes come from, e.g. "maker's sheet" or "from memory". */
    source: z.string().trim().max(WIRE_LIMITS.sourceMaxChars, { message: `must be at most ${WIRE_LIMITS.sourceMaxChars} characters` }).default(''),
  })
  .strict()
  .superRefine((wire, ctx) => {
    if (wire.barbWidthMm <= wire.tangWidthMm) {
      ctx.addIssue({ code: z.ZodIssueCode.custom, path: ['barbWidthMm'], message: 'must be wider than the tang (the barbs stand out from it)' });
    }
  });

export const fretWireUpdateSchema = fretWireInputSchema;

export type FretWireInput = z.output<typeof fretWireInputSchema>;

export interface FretWire extends FretWireInput {
  id: number;
}
