import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { DashboardService } from '../services/dashboard.service';
import { MyBenchService } from '../services/my-bench.service';
import { bookers } from './planning-access';
import { myBenchSchema } from '../../shared/schemas/benches';
import { dashboardSchema } from '../../shared/schemas/dashboard';

export function registerMyBenchRoutes(api: ApiRegistry, { dataSource }: AppContext) {
  const myBench = new MyBenchService(dataSource);
  const dashboard = new DashboardService(dataSource);

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
