import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { bookers } from '../../shared/access/roles';
import { myBenchSchema } from '../../shared/schemas/benches';
import { dashboardSchema } from '../../shared/schemas/dashboard';

export function registerMyBenchRoutes(api: ApiRegistry, { services }: AppContext) {
  const myBench = services.myBench;
  const dashboard = services.dashboard;

  api.add({
    method: 'get',
    path: '/api/my-bench',
    access: bookers,
    tag: 'My bench',
    summary: 'Your queue sorted by due date, recorded cells awaiting the editor, and your upcoming bookings.',
    response: myBenchSchema,
    handler: ({ user }) => myBench.forUser(user),
  });

  api.add({
    method: 'get',
    path: '/api/dashboard',
    access: 'signed-in',
    tag: 'Dashboard',
    summary: 'The home page for your role: editor, tester, or an overview for writers and admins.',
    response: dashboardSchema,
    handler: ({ user }) => dashboard.forUser(user),
  });
}
