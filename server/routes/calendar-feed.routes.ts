import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { bookers } from '../../shared/access/roles';
import {
  calendarFeedCreatedSchema,
  calendarFeedParamsSchema,
  calendarFeedSchema,
} from '../../shared/schemas/calendar-feed';

export function registerCalendarFeedRoutes(api: ApiRegistry, { services }: AppContext) {
  const feeds = services.calendarFeeds;

  api.add({
    method: 'get',
    path: '/api/account/calendar-feed',
    access: bookers,
    tag: 'Account',
    summary: 'Whether you have a private calendar feed of your bookings and due dates.',
    response: calendarFeedSchema,
    handler: ({ user }) => feeds.status(user),
  });

  api.add({
    method: 'post',
    path: '/api/account/calendar-feed',
    access: bookers,
    tag: 'Account',
    summary: 'Make a new secret feed address; an earlier one stops working. The address is shown only now.',
    response: calendarFeedCreatedSchema,
    handler: async ({ user, res }) => {
      res.setHeader('Cache-Control', 'no-store');
      return feeds.reset(user);
    },
  });

  api.add({
    method: 'delete',
    path: '/api/account/calendar-feed',
    access: bookers,
    tag: 'Account',
    summary: 'Turn your calendar feed off; its address stops working.',
    successStatus: 204,
    handler: ({ user }) => feeds.disable(user),
  });

  api.add({
    method: 'get',
    path: '/api/calendar/:token.ics',
    // The secret in the address is the key: calendar apps fetch it without a session. Unknown tokens are 404.
    access: 'public',
    tag: 'Account',
    summary: 'A private iCalendar feed (RFC 5545) of one tester’s bookings and due dates.',
    params: calendarFeedParamsSchema,
    produces: 'text/calendar',
    handler: async ({ params, res }) => {
      const text = await feeds.feed(params.token);
      res.setHeader('Content-Type', 'text/calendar; charset=utf-8');
      res.setHeader('Cache-Control', 'private, no-cache');
      res.setHeader('X-Robots-Tag', 'noindex');
      res.status(200).send(text);
    },
  });
}
