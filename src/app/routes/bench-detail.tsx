import { Link, useParams } from 'react-router';
import { PageHeader } from '../../components/ui/page-header';
import { addressId } from '../../lib/address-id';
import { paths } from '../../lib/paths';
import { BenchCautions } from '../../features/bench-booking/components/bench-cautions';
import { benchDetailQueryOptions, useBenchDetail } from '../../features/benches/api/bench-detail';
import { BenchDetailView } from '../../features/benches/components/bench-detail-view';
import { benchWorkers, may, planEditors } from '../../../shared/access/roles';
import type { CurrentUser } from '../../../shared/schemas/auth';
import { gatedPage, pageLoader, useOpenedAt } from '../page-route';

export const loader = pageLoader(paths.benches, (queryClient, { params }) =>
  queryClient.ensureQueryData(benchDetailQueryOptions(addressId(params.benchId))),
);

export const Component = gatedPage({ path: paths.benches, pageName: 'Bench' }, BenchPage);

function BenchPage({ user }: { user: CurrentUser }) {
  const detail = useBenchDetail(addressId(useParams().benchId));
  const today = new Date(useOpenedAt()).toISOString().slice(0, 10);
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
