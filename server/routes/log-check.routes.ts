import multer from 'multer';
import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { AppError } from '../errors';
import { decodeLogFile } from '../services/log-file.service';
import { parseOrThrow } from '../api-registry';
import { analysisRequestSchema, analysisPreviewResponseSchema } from '../../shared/schemas/analysis';
import { analyseLog } from '../../shared/domain/analysis/analyse-log';

export const MAX_LOG_BYTES = 25 * 1024 * 1024;

export function registerLogCheckRoutes(api: ApiRegistry, _context: AppContext) {
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: MAX_LOG_BYTES, files: 1, fields: 4 } });

  api.add({
    method: 'post',
    path: '/api/log-check/analyse',
    access: ['tester', 'editor'],
    tag: 'Log check',
    summary:
      'Analyse a logger file (CSV/TSV) without saving it: the parsed-column preview and the full analysis, or 422 with row-and-column parse errors.',
    multipart: { fields: { file: 'file', request: 'json' } },
    response: analysisPreviewResponseSchema,
    successStatus: 200,
    before: [upload.single('file')],
    handler: ({ req, res }) => {
      if (!req.file) {
        throw new AppError('validation_failed', 400, 'Attach a logger file (CSV or TSV).', { file: 'Choose a file.' });
      }
      let requestJson: unknown = {};
      if (typeof req.body?.request === 'string' && req.body.request.trim()) {
        try {
          requestJson = JSON.parse(req.body.request);
        } catch {
          throw new AppError('validation_failed', 400, 'The analysis settings are not valid JSON.', {
            request: 'Not valid JSON.',
          });
        }
      }
      const request = parseOrThrow(analysisRequestSchema, requestJson, 'analysis setting');
      const text = decodeLogFile(req.file.originalname, req.file.buffer);
      const outcome = analyseLog(text, request);
      if (!outcome.ok) {
        res.status(422);
        return {
          error: {
            code: 'log_parse_failed',
            message: 'The logger file could not be read. See the listed rows and columns.',
          },
          preview: outcome.preview ?? null,
          errors: outcome.errors,
        };
      }
      return { preview: outcome.preview, analysis: outcome.analysis };
    },
  });
}
