import type { z } from 'zod';

/**
 * For `.refine(…, { when })` and `.superRefine(…, { when })` on objects: run the check as soon as the fields it
 * reads are valid, even while other fields still have problems. Zod otherwise skips object checks until every
 * field passes, and a form would show its errors in two rounds.
 */
export function whenValid(...fields: string[]) {
  return (payload: z.core.ParsePayload): boolean =>
    !payload.issues.some((issue) => {
      // An unknown extra key says nothing about the fields the check reads.
      if (issue.code === 'unrecognized_keys') return false;
      const path = issue.path ?? [];
      return path.length === 0 || fields.includes(String(path[0]));
    });
}
