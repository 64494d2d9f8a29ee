import { z } from 'zod';

/** The parsed Scala scale as POST /api/scala returns it (see ScalaScale in geometry/scala.ts). */
export const scalaScaleResponseSchema = z.object({
  description: z.string(),
  pitches: z.array(z.object({ text: z.string(), cents: z.number(), ratio: z.number(), line: z.number() })),
});

export type ScalaScaleResponse = z.infer<typeof scalaScaleResponseSchema>;
