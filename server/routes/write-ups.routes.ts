import { sendInertHtml } from '../lib/inert-html';
import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { planningReaders, writeUpApprovers, writeUpWriters } from '../../shared/access/roles';
import { idParamSchema } from '../../shared/schemas/common';
import {
  addCommentRequestSchema,
  commentParamsSchema,
  commentThreadListSchema,
  commentThreadSchema,
  handBackRequestSchema,
  restoreRevisionRequestSchema,
  revisionDetailSchema,
  revisionListSchema,
  revisionParamsSchema,
  saveSectionRequestSchema,
  sectionDetailSchema,
  sectionParamsSchema,
  sectionSummarySchema,
  staleVersionDetailsSchema,
  writeUpOverviewSchema,
} from '../../shared/schemas/write-ups';
import { writeUpPreviewPage } from '../editorial/write-up-preview-page';

export function registerWriteUpRoutes(api: ApiRegistry, { services }: AppContext) {
  const { writeUps } = services;
  const tag = 'Write-up';

  api.add({
    method: 'get',
    path: '/api/roundups/:id/write-up',
    access: planningReaders,
    tag,
    summary:
      'The roundup’s write-up: its sections in order with their review state and open threads, and what keeps it from being ready. Sections are created when the roundup first reaches Writing.',
    params: idParamSchema,
    response: writeUpOverviewSchema,
    handler: ({ params, user }) => writeUps.overview(params.id, user),
  });

  api.add({
    method: 'get',
    path: '/api/roundups/:id/write-up/preview',
    access: planningReaders,
    tag,
    summary: 'The write-up as the public page will show it (a stand-in page until the reader site renders it).',
    params: idParamSchema,
    produces: 'text/html',
    handler: async ({ params, res }) => {
      const html = writeUpPreviewPage(await writeUps.renderedSections(params.id));
      // Nothing on this page runs: even a fragment that slipped past the renderer could not execute here.
      sendInertHtml(res, html, { imgSrc: "'self'" });
    },
  });

  api.add({
    method: 'get',
    path: '/api/write-up/sections/:sectionId',
    access: planningReaders,
    tag,
    summary:
      'One section with its editor document, the live blocks it can show (rendered from current data) and the roundup’s photos.',
    params: sectionParamsSchema,
    response: sectionDetailSchema,
    handler: ({ params, user }) => writeUps.section(params.sectionId, user),
  });

  api.add({
    method: 'put',
    path: '/api/write-up/sections/:sectionId',
    access: writeUpWriters,
    tag,
    summary:
      'Save a section’s text, naming the version it started from. A save from an older version is refused with 409 `stale_version` (its text kept as a revision); changing a signed-off section hands it back to drafting.',
    params: sectionParamsSchema,
    body: saveSectionRequestSchema,
    response: sectionSummarySchema,
    errors: {
      409: { description: 'Someone saved the section after this version.', details: staleVersionDetailsSchema },
    },
    handler: ({ params, body, user }) => writeUps.save(user, params.sectionId, body),
  });

  api.add({
    method: 'post',
    path: '/api/write-up/sections/:sectionId/review-request',
    access: writeUpWriters,
    tag,
    summary: 'Hand a drafted section to the editor for review.',
    params: sectionParamsSchema,
    response: sectionSummarySchema,
    successStatus: 200,
    handler: ({ params, user }) => writeUps.move(user, params.sectionId, 'hand-to-editor'),
  });

  api.add({
    method: 'post',
    path: '/api/write-up/sections/:sectionId/sign-off',
    access: writeUpApprovers,
    tag,
    summary: 'Sign off a section: it is ready to publish as it stands.',
    params: sectionParamsSchema,
    response: sectionSummarySchema,
    successStatus: 200,
    handler: ({ params, user }) => writeUps.move(user, params.sectionId, 'sign-off'),
  });

  api.add({
    method: 'post',
    path: '/api/write-up/sections/:sectionId/hand-back',
    access: writeUpApprovers,
    tag,
    summary: 'Hand a section back to the writer, optionally with a note that opens a comment thread.',
    params: sectionParamsSchema,
    body: handBackRequestSchema,
    response: sectionSummarySchema,
    successStatus: 200,
    handler: ({ params, body, user }) => writeUps.move(user, params.sectionId, 'hand-back', body.note),
  });

  api.add({
    method: 'get',
    path: '/api/write-up/sections/:sectionId/revisions',
    access: planningReaders,
    tag,
    summary: 'The section’s revisions, newest first: saves, restores and copies of refused saves.',
    params: sectionParamsSchema,
    response: revisionListSchema,
    handler: async ({ params }) => ({ revisions: await writeUps.revisions(params.sectionId) }),
  });

  api.add({
    method: 'get',
    path: '/api/write-up/sections/:sectionId/revisions/:revisionId',
    access: planningReaders,
    tag,
    summary: 'One revision with its document and how it renders.',
    params: revisionParamsSchema,
    response: revisionDetailSchema,
    handler: ({ params }) => writeUps.revision(params.sectionId, params.revisionId),
  });

  api.add({
    method: 'post',
    path: '/api/write-up/sections/:sectionId/revisions/:revisionId/restore',
    access: writeUpWriters,
    tag,
    summary: 'Make a revision the section’s text again, as a new version; the history keeps everything.',
    params: revisionParamsSchema,
    body: restoreRevisionRequestSchema,
    response: sectionSummarySchema,
    successStatus: 200,
    errors: { 409: { description: 'The section was saved again since this version.' } },
    handler: ({ params, body, user }) => writeUps.restore(user, params.sectionId, params.revisionId, body.baseVersion),
  });

  api.add({
    method: 'get',
    path: '/api/write-up/sections/:sectionId/comments',
    access: planningReaders,
    tag,
    summary: 'The comment threads on a section, each with its replies.',
    params: sectionParamsSchema,
    response: commentThreadListSchema,
    handler: async ({ params }) => ({ threads: await writeUps.threads(params.sectionId) }),
  });

  api.add({
    method: 'post',
    path: '/api/write-up/sections/:sectionId/comments',
    access: writeUpWriters,
    tag,
    summary: 'Start a comment thread on a section, or reply to one (a reply reopens a resolved thread).',
    params: sectionParamsSchema,
    body: addCommentRequestSchema,
    response: commentThreadSchema,
    handler: ({ params, body, user }) => writeUps.addComment(user, params.sectionId, body),
  });

  api.add({
    method: 'post',
    path: '/api/write-up/comments/:commentId/resolve',
    access: writeUpWriters,
    tag,
    summary: 'Mark a comment thread resolved.',
    params: commentParamsSchema,
    response: commentThreadSchema,
    successStatus: 200,
    handler: ({ params, user }) => writeUps.setResolved(user, params.commentId, true),
  });

  api.add({
    method: 'post',
    path: '/api/write-up/comments/:commentId/reopen',
    access: writeUpWriters,
    tag,
    summary: 'Reopen a resolved comment thread.',
    params: commentParamsSchema,
    response: commentThreadSchema,
    successStatus: 200,
    handler: ({ params, user }) => writeUps.setResolved(user, params.commentId, false),
  });
}
