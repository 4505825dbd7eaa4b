import { z } from 'zod';
import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { sendStoredBytes } from '../lib/send-stored-bytes';
import { benchWorkers, planEditors, planningReaders } from '../../shared/access/roles';
import { idParamSchema } from '../../shared/schemas/common';
import {
  cellRunsParamsSchema,
  cellRunsSchema,
  createRunResponseSchema,
  loggerRunRequestSchema,
  manualRunRequestSchema,
  reanalyseRunRequestSchema,
  reviewRunRequestSchema,
  roundupResultsSchema,
  roundupRubricRequestSchema,
  runParamsSchema,
  testRunSchema,
} from '../../shared/schemas/test-runs';

import { logFileUploadLimit } from '../../shared/upload-limits';
import { storageWriteErrors } from '../storage/storage-errors';

/** The form's text field: the run's details as JSON beside the logger file. */
const loggerRunFormSchema = z.object({ request: loggerRunRequestSchema });

export function registerTestRunRoutes(api: ApiRegistry, { services }: AppContext) {
  const runs = services.testRuns;

  api.add({
    method: 'get',
    path: '/api/cells/:cellId/runs',
    access: planningReaders,
    tag: 'Test runs',
    summary: 'The runs of one matrix cell with their current analyses, grouped by firmware with repeat-run statistics.',
    params: cellRunsParamsSchema,
    response: cellRunsSchema,
    handler: ({ params, user }) => runs.cellRuns(params.cellId, user),
  });

  api.add({
    method: 'post',
    path: '/api/cells/:cellId/runs',
    access: benchWorkers,
    tag: 'Test runs',
    summary:
      'Record a run from a logger file: the file is stored byte for byte with its SHA-256 and analysed with the confirmed mapping; the same file twice on one cell is refused (409).',
    params: cellRunsParamsSchema,
    multipart: { fields: { file: 'file', request: 'json' }, limit: logFileUploadLimit },
    body: loggerRunFormSchema,
    errors: storageWriteErrors,
    response: createRunResponseSchema,
    handler: async ({ req, params, user, body }) => {
      const runId = await runs.createLoggerRun(user, params.cellId, req.file, body.request);
      return { run: await runs.run(runId, user), sameFileAsRunId: null };
    },
  });

  api.add({
    method: 'post',
    path: '/api/cells/:cellId/manual-runs',
    access: benchWorkers,
    tag: 'Test runs',
    summary: 'Record a run by hand (peak and ambient) when no log exists; it is marked manual everywhere.',
    params: cellRunsParamsSchema,
    body: manualRunRequestSchema,
    response: createRunResponseSchema,
    handler: async ({ params, user, body }) => {
      const runId = await runs.createManualRun(user, params.cellId, body);
      return { run: await runs.run(runId, user), sameFileAsRunId: null };
    },
  });

  api.add({
    method: 'get',
    path: '/api/runs/:runId',
    access: planningReaders,
    tag: 'Test runs',
    summary:
      'One run with its current analysis, earlier analyses, VRM electrical load and review (a tester: their own runs).',
    params: runParamsSchema,
    response: testRunSchema,
    handler: ({ params, user }) => runs.run(params.runId, user),
  });

  api.add({
    method: 'get',
    path: '/api/runs/:runId/logger-file',
    access: planningReaders,
    tag: 'Test runs',
    summary: 'Download the stored logger file exactly as it was uploaded (a tester: their own runs).',
    params: runParamsSchema,
    produces: 'text/plain',
    handler: async ({ params, res, user }) => {
      const { file, body } = await runs.loggerFile(params.runId, user);
      const asciiName = file.originalName.replace(/[^A-Za-z0-9._-]/g, '_');
      sendStoredBytes(res, body, 'application/octet-stream', 'private, no-store', {
        'Content-Disposition': `attachment; filename="${asciiName}"; filename*=UTF-8''${encodeURIComponent(file.originalName)}`,
        'X-Checksum-SHA256': file.sha256,
      });
    },
  });

  api.add({
    method: 'post',
    path: '/api/runs/:runId/analyses',
    access: benchWorkers,
    tag: 'Test runs',
    summary: 'Analyse the stored file again with another mapping or options; earlier analyses are kept.',
    params: runParamsSchema,
    body: reanalyseRunRequestSchema,
    response: testRunSchema,
    handler: async ({ params, user, body }) => runs.run(await runs.reanalyse(user, params.runId, body), user),
  });

  api.add({
    method: 'post',
    path: '/api/runs/:runId/review',
    access: planEditors,
    tag: 'Test runs',
    summary:
      'Accept a run (a flagged run needs a written reason) or send it back for retest with a reason the tester sees.',
    params: runParamsSchema,
    body: reviewRunRequestSchema,
    response: testRunSchema,
    successStatus: 200,
    handler: async ({ params, user, body }) => runs.run(await runs.review(user, params.runId, body), user),
  });

  api.add({
    method: 'post',
    path: '/api/runs/:runId/run-of-record',
    access: planEditors,
    tag: 'Test runs',
    summary: 'Make this run the one that stands for its cell in results and charts.',
    params: runParamsSchema,
    response: testRunSchema,
    successStatus: 200,
    handler: async ({ params, user }) => runs.run(await runs.markRunOfRecord(user, params.runId), user),
  });

  api.add({
    method: 'get',
    path: '/api/roundups/:id/results',
    access: planningReaders,
    tag: 'Test runs',
    summary: 'The results matrix: per cell, the run of record’s figures, verdict under the roundup’s rubric and flags.',
    params: idParamSchema,
    response: roundupResultsSchema,
    handler: ({ params }) => runs.results(params.id),
  });

  api.add({
    method: 'put',
    path: '/api/roundups/:id/rubric',
    access: planEditors,
    tag: 'Test runs',
    summary: 'Set the roundup’s verdict rubric (null: the engine’s defaults); every run is analysed again under it.',
    params: idParamSchema,
    body: roundupRubricRequestSchema,
    response: roundupResultsSchema,
    handler: async ({ params, user, body }) => {
      await runs.setRubric(user, params.id, body.rubric);
      return runs.results(params.id);
    },
  });
}
