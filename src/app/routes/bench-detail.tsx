import type { QueryClient } from '@tanstack/react-query';
import { Link, useLoaderData, useParams, type LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { BenchCautions } from '../../features/bench-booking/components/bench-cautions';
import { benchDetailQueryOptions, useBenchDetail } from '../../features/benches/api/bench-detail';
import { BenchDetailView } from '../../features/benches/components/bench-detail-view';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';
import { benchWorkers, may, planEditors } from '../../../shared/access/roles';

export function loader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    const id = Number(params.benchId);
    if (user && canOpen(paths.benches, user.role) && Number.isInteger(id) && id > 0) {
      await queryClient.ensureQueryData(benchDetailQueryOptions(id));
    }
    return { today: new Date().toISOString().slice(0, 10) };
  };
}

export function Component() {
  return (
    <RoleGate path={paths.benches} pageName="Bench">
      <BenchPage />
    </RoleGate>
  );
}

function BenchPage() {
  const user = useSession();
  const { benchId } = useParams();
  const { today } = useLoaderData() as { today: string };
  const detail = useBenchDetail(Number(benchId));
  if (!user) return null;
  return (
    <>
      <PageHeader
        eyebrow="Benches"
        title={detail.bench.name}
        description={[detail.bench.location, detail.bench.active ? 'In service' : 'Out of service']
          .filter(Boolean)
          .join(' · ')}
        actions={
          <Link to={`${paths.benches}?bench=${detail.bench.id}`} className="text-sm underline underline-offset-2">
            This bench’s bookings
          </Link>
        }
      />
      <BenchCautions className="mb-5" />
      <BenchDetailView
        detail={detail}
        canManage={may(user.role, planEditors)}
        canLog={may(user.role, benchWorkers)}
        today={today}
      />
    </>
  );
}
