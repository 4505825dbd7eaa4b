import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { openDataSettingsEditors, planEditors, planningReaders } from '../../shared/access/roles';
import { idParamSchema } from '../../shared/schemas/common';
import {
  openDataSettingsRequestSchema,
  openDataSettingsSchema,
  previewLinkRequestSchema,
  previewLinkSchema,
  publishUpdateRequestSchema,
  roundupPublishingSchema,
  scheduleRoundupRequestSchema,
} from '../../shared/schemas/publishing';

export function registerPublishingRoutes(api: ApiRegistry, { services }: AppContext) {
  const publishing = services.publishing;

  api.add({
    method: 'get',
    path: '/api/roundups/:id/publishing',
    access: planningReaders,
    tag: 'Publishing',
    summary: 'Whether the roundup may be scheduled, its schedule (UTC instant and local time), and its publications.',
    params: idParamSchema,
    response: roundupPublishingSchema,
    handler: ({ params }) => publishing.status(params.id),
  });

  api.add({
    method: 'put',
    path: '/api/roundups/:id/schedule',
    access: planEditors,
    tag: 'Publishing',
    summary:
      'Schedule a ready roundup (In review → Scheduled) or move its time: a local date and time in an IANA time zone.',
    params: idParamSchema,
    body: scheduleRoundupRequestSchema,
    response: roundupPublishingSchema,
    handler: ({ user, params, body }) => publishing.schedule(user, params.id, body),
  });

  api.add({
    method: 'delete',
    path: '/api/roundups/:id/schedule',
    access: planEditors,
    tag: 'Publishing',
    summary: 'Take a scheduled roundup off the schedule (Scheduled → In review).',
    params: idParamSchema,
    response: roundupPublishingSchema,
    handler: ({ user, params }) => publishing.unschedule(user, params.id),
  });

  api.add({
    method: 'post',
    path: '/api/roundups/:id/publication-updates',
    access: planEditors,
    tag: 'Publishing',
    summary: "Publish the roundup's current data to readers as a dated update or correction with a note.",
    params: idParamSchema,
    body: publishUpdateRequestSchema,
    response: roundupPublishingSchema,
    successStatus: 201,
    handler: ({ user, params, body }) => publishing.publishUpdate(user, params.id, body),
  });

  api.add({
    method: 'post',
    path: '/api/roundups/:id/preview-links',
    access: planEditors,
    tag: 'Publishing',
    summary: 'A signed link to the unpublished page that works without an account until it expires.',
    params: idParamSchema,
    body: previewLinkRequestSchema,
    response: previewLinkSchema,
    successStatus: 201,
    handler: async ({ req, user, params, body }) => {
      const link = await publishing.createPreviewLink(user, params.id, body.hours);
      return { ...link, url: `${req.protocol}://${req.get('host') ?? 'localhost'}${link.path}` };
    },
  });

  api.add({
    method: 'get',
    path: '/api/roundups/:id/open-data',
    access: openDataSettingsEditors,
    tag: 'Publishing',
    summary:
      "Whether the roundup's raw logger files are downloadable by readers, and the outlet's open-data licence line.",
    params: idParamSchema,
    response: openDataSettingsSchema,
    handler: ({ params }) => services.openDataSettings.get(params.id),
  });

  api.add({
    method: 'put',
    path: '/api/roundups/:id/open-data',
    access: openDataSettingsEditors,
    tag: 'Publishing',
    summary:
      "Offer the roundup's raw logger files to readers or not, and set the outlet's licence line; published pages follow at once.",
    params: idParamSchema,
    body: openDataSettingsRequestSchema,
    response: openDataSettingsSchema,
    handler: ({ user, params, body }) => services.openDataSettings.set(user, params.id, body),
  });
}
