import { z } from 'zod';
import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { buildOpenApiDocument } from '../openapi';

const healthSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  database: z.enum(['up', 'down']),
  time: z.string(),
});

export function registerSystemRoutes(api: ApiRegistry, { dataSource, services }: AppContext) {
  api.add({
    method: 'get',
    path: '/api/health',
    access: 'public',
    tag: 'System',
    summary: 'Liveness and database state, for load balancers and monitoring.',
    response: healthSchema,
    handler: async ({ res }) => {
      const database = await dataSource
        .query('SELECT 1')
        .then(() => 'up' as const)
        .catch(() => 'down' as const);
      if (database === 'down') res.status(503);
      return { status: database === 'up' ? 'ok' : 'degraded', database, time: new Date().toISOString() };
    },
  });

  let document: unknown = null;
  api.add({
    method: 'get',
    path: '/api/openapi.json',
    access: 'public',
    tag: 'System',
    summary: 'This API described as OpenAPI 3.1, including which roles may call each operation.',
    handler: () => (document ??= buildOpenApiDocument(api.routes, services.sessions.sessionCookieName)),
  });
}
