import type { z } from 'zod';
import { endpointQueryOptions } from '../../../lib/endpoint-query';
import { editorialKeys } from './editorial-keys';

export type EditorialView = 'charts' | 'verdicts' | 'readiness';

/** One editorial view of a roundup: cached under the roundup's editorial key, read from `/api/roundups/:id/<view>`. */
export function roundupViewQueryOptions<T, const View extends EditorialView>(
  roundupId: number,
  view: View,
  schema: z.ZodType<T>,
) {
  return endpointQueryOptions([...editorialKeys.detail(roundupId), view], `/api/roundups/${roundupId}/${view}`, schema);
}
