import { z } from 'zod';
import { roundupSummarySchema } from './roundups';
import { roundupStateSchema } from './roundup-state';
import { overdueSampleSchema } from './samples';
import { myBenchSchema } from './benches';

export const roundupsByStateSchema = z.array(
  z.object({ state: roundupStateSchema, roundups: z.array(roundupSummarySchema) }),
);

/**
 * One dashboard per role. Editors: roundups by state (each with matrix progress), overdue loans, unassigned
 * cells. Testers: their queue and bookings. Writers and admins: roundups by state.
 */
export const dashboardSchema = z.discriminatedUnion('view', [
  z.object({
    view: z.literal('editor'),
    roundupsByState: roundupsByStateSchema,
    overdueSamples: z.array(overdueSampleSchema),
    unassignedCells: z.array(
      z.object({ roundupId: z.number().int(), title: z.string(), unassignedCount: z.number().int() }),
    ),
  }),
  z.object({ view: z.literal('tester') }).extend(myBenchSchema.shape),
  z.object({ view: z.literal('overview'), roundupsByState: roundupsByStateSchema }),
]);
export type Dashboard = z.infer<typeof dashboardSchema>;
