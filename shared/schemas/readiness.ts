import { z } from 'zod';
import { pathIdsSchema } from './common';
import { multiLineText } from './text';

export const readinessBlockerKinds = ['state', 'section', 'chart', 'verdict', 'cell'] as const;

/** One thing that keeps a roundup from being ready to schedule, with the screen where it is fixed. */
export const readinessBlockerSchema = z.object({
  kind: z.string(),
  label: z.string(),
  link: z.string(),
  /** For a matrix cell: its id, so the editor can leave it out from the same list. */
  cellId: z.number().int().optional(),
});
export type ReadinessBlocker = z.infer<typeof readinessBlockerSchema>;

export const readinessSchema = z.object({
  roundupId: z.number().int(),
  ready: z.boolean(),
  blocking: z.array(readinessBlockerSchema),
  /** Cells the editor left out of the roundup, with why. */
  excludedCells: z.array(z.object({ cellId: z.number().int(), label: z.string(), reason: z.string() })),
  state: z.string(),
  /** Whether the signed-in person's role may send the roundup to review now. */
  canRequestReview: z.boolean(),
});
export type Readiness = z.infer<typeof readinessSchema>;

export const cellExclusionParamsSchema = pathIdsSchema('id', 'cellId');

export const excludeCellRequestSchema = z.strictObject({
  reason: multiLineText(1000, 'Write why this cell is left out of the roundup.'),
});

/** Sending to review takes no fields: notes for the editor belong in the write-up's comment threads. */
export const reviewRequestSchema = z.strictObject({});
