import { useEffect } from 'react';
import { useLocation, useParams } from 'react-router';
import { PageHeader } from '../../components/ui/page-header';
import { addressId } from '../../lib/address-id';
import { paths } from '../../lib/paths';
import { useRoundup } from '../../features/roundups/api/get-roundup';
import { chartsQueryOptions, useApproveChart, useCharts, useChartSettings } from '../../features/editorial/api/charts';
import { ChartCard } from '../../features/editorial/components/chart-card';
import { EditorialNav } from '../../features/editorial/components/editorial-nav';
import { editorialDeciders, may } from '../../../shared/access/roles';
import type { CurrentUser } from '../../../shared/schemas/auth';
import { gatedPage, roundupPageLoader } from '../page-route';

export const loader = roundupPageLoader((queryClient, id) => [queryClient.ensureQueryData(chartsQueryOptions(id))]);

export const Component = gatedPage({ path: paths.roundups, pageName: 'Charts' }, ChartsPage);

function ChartsPage({ user }: { user: CurrentUser }) {
  const roundupId = addressId(useParams().id);
  const roundup = useRoundup(roundupId);
  const charts = useCharts(roundupId);
  const approve = useApproveChart(roundupId);
  const settings = useChartSettings(roundupId);
  const { hash } = useLocation();
  useEffect(() => {
    if (hash) document.getElementById(hash.slice(1))?.scrollIntoView();
  }, [hash]);
  const canDecide = charts.editable && may(user.role, editorialDeciders);
  const open = charts.charts.filter((c) => c.status === 'not-approved' || c.status === 'stale').length;
  return (
    <>
      <PageHeader
        eyebrow={roundup.title}
        title="Charts"
        description={
          open === 0
            ? 'Every chart with something to draw is approved.'
            : `${open} chart${open === 1 ? '' : 's'} to approve. Approving freezes exactly what the chart shows; a later change to a run of record, its analysis, the rubric, the references or a price marks it stale.`
        }
      />
      <EditorialNav roundupId={roundupId} />
      <div className="space-y-5">
        {charts.charts.map((chart) => (
          <ChartCard
            key={`${chart.key}-${chart.snapshotHash}`}
            chart={chart}
            loadConfigurations={charts.loadConfigurations}
            canDecide={canDecide}
            approving={approve.isPending && approve.variables?.key === chart.key}
            savingSettings={settings.isPending && settings.variables?.key === chart.key}
            onApprove={() => approve.mutateAsync({ key: chart.key, snapshotHash: chart.snapshotHash })}
            onSettings={(next) => settings.mutateAsync({ key: chart.key, settings: next })}
          />
        ))}
      </div>
    </>
  );
}
