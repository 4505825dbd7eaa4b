import type { z } from 'zod';
import { apiClient } from './api-client';

/** The input of an edit: the record's id and only the fields that change. */
export interface EditInput<Changes> {
  id: number;
  changes: Changes;
}

/** The request that creates a record: POST to its collection, the saved record read through `schema`. */
export function createRecord<Request, Result>(collection: string, schema: z.ZodType<Result>) {
  return (input: Request): Promise<Result> => apiClient.post(collection, input, { schema });
}

/** The request that edits a record: PATCH `<collection>/<id>` with the changed fields, read back through `schema`. */
export function editRecord<Changes, Result>(collection: string, schema: z.ZodType<Result>) {
  return ({ id, changes }: EditInput<Changes>): Promise<Result> =>
    apiClient.patch(`${collection}/${id}`, changes, { schema });
}
