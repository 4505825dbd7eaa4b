import { z } from 'zod';
import type { ApiRegistry } from '../api-registry';
import { logCheckers } from '../../shared/access/roles';
import type { AppContext } from '../app-context';
import {
  analysisPreviewFailureSchema,
  analysisPreviewResponseSchema,
  analysisRequestSchema,
} from '../../shared/schemas/analysis';
import { logFileUploadLimit } from '../../shared/upload-limits';

/** The form's text field: the analysis settings as JSON (mapping and options; all optional). */
const logCheckFormSchema = z.object({ request: analysisRequestSchema.prefault({}) });

export function registerLogCheckRoutes(api: ApiRegistry, { services }: AppContext) {
  const { logCheck } = services;

  api.add({
    method: 'post',
    path: '/api/log-check/analyse',
    access: logCheckers,
    tag: 'Log check',
    summary:
      'Analyse a logger file (CSV/TSV) without saving it: the parsed-column preview and the full analysis, or 422 log_parse_failed with the preview and the row-and-column parse errors in error.details.',
    multipart: { fields: { file: 'file', request: 'json' }, limit: logFileUploadLimit },
    body: logCheckFormSchema,
    response: analysisPreviewResponseSchema,
    errors: {
      422: { description: 'The file could not be read (log_parse_failed)', details: analysisPreviewFailureSchema },
    },
    successStatus: 200,
    handler: ({ req, res, body }) => {
      // A tester who cancels the upload or closes the page stops the analysis too.
      const gone = new AbortController();
      res.on('close', () => {
        if (!res.writableFinished) gone.abort();
      });
      return logCheck.analyse(req.file, body.request, gone.signal);
    },
  });
}
