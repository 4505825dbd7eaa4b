import { z } from 'zod';
import type { PublishingService } from '../services/publishing.service';
import type { JobKind } from './job-registry';

const payload = z.object({ roundupId: z.number().int().positive() });

/** Makes a scheduled roundup live at its embargo time (a no-op when it is already live or was unscheduled). */
export function publishRoundupJob(publishing: PublishingService): JobKind<z.infer<typeof payload>> {
  return {
    payload,
    maxAttempts: 20,
    // A publication that fails (a database hiccup) is retried soon: readers are waiting for it.
    backoffMs: (attempts) => Math.min(2_000 * 2 ** (attempts - 1), 5 * 60_000),
    handler: async ({ job, now }) => {
      await publishing.publishDue(job.payload.roundupId, now);
    },
  };
}
