import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { ApiError, apiRequest } from '../../src/lib/api-client';
import { uploadFile, type UploadProgress } from '../../src/lib/upload';
import { catalogImportUploadLimit as limit } from '../../shared/upload-limits';
import { installFakeUploadServer } from './support/fake-upload-server';

const file = { blob: new Blob(['a,b\n1,2\n'], { type: 'text/csv' }), fileName: 'table.csv' };
const answerSchema = z.object({ rows: z.number() });

async function rejectionOf(promise: Promise<unknown>): Promise<unknown> {
  try {
    await promise;
  } catch (error) {
    return error;
  }
  throw new Error('Expected a rejection.');
}

afterEach(() => vi.unstubAllGlobals());

describe('the upload helper', () => {
  it('reads a server error exactly as every other request does, details included', async () => {
    const body = {
      error: {
        code: 'log_parse_failed',
        message: 'The logger file could not be read.',
        fields: { file: 'See the rows.' },
        details: { preview: null, errors: [{ row: 3, column: 'VRM 1', code: 'not-a-number', message: 'x' }] },
      },
    };
    installFakeUploadServer(async () => ({ status: 422, body }));
    vi.stubGlobal('fetch', async () => new Response(JSON.stringify(body), { status: 422 }));

    const fromUpload = await rejectionOf(uploadFile({ path: '/api/x', file, schema: answerSchema, limit }));
    const fromFetch = await rejectionOf(apiRequest('/api/x', { method: 'POST', body: {} }));
    expect(fromUpload).toBeInstanceOf(ApiError);
    expect(fromUpload).toEqual(fromFetch);
    expect(fromUpload).toMatchObject({ status: 422, code: 'log_parse_failed', details: body.error.details });
  });

  it('reports progress while sending, then that the server is working, and resolves with the checked answer', async () => {
    const seen: UploadProgress['phase'][] = [];
    const server = installFakeUploadServer(async () => ({ status: 200, body: { rows: 1 } }));
    const answer = await uploadFile({
      path: '/api/x',
      file,
      fields: { checksum: 'abc' },
      schema: answerSchema,
      limit,
      onProgress: (progress) => seen.push(progress.phase),
    });
    expect(answer).toEqual({ rows: 1 });
    expect(seen[0]).toBe('uploading');
    expect(seen.at(-1)).toBe('processing');
    expect(server.sent[0].fields).toEqual({ checksum: 'abc' });
    expect(await server.sent[0].file?.text()).toBe('a,b\n1,2\n');
  });

  it('refuses an answer that does not match the schema, and a file over the limit before sending', async () => {
    const server = installFakeUploadServer(async () => ({ status: 200, body: { rows: 'many' } }));
    expect(await rejectionOf(uploadFile({ path: '/api/x', file, schema: answerSchema, limit }))).toMatchObject({
      code: 'unexpected_response',
    });
    expect(
      await rejectionOf(
        uploadFile({ path: '/api/x', file, schema: answerSchema, limit: { ...limit, maxFileBytes: 4 } }),
      ),
    ).toMatchObject({
      status: 413,
      message: `“table.csv” is 8\u2009B; the limit is 4\u2009B. ${limit.whenTooLarge}`,
    });
    expect(server.sent).toHaveLength(1);
  });
});
