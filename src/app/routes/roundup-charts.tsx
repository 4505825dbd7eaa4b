import { useEffect } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { useLocation, useParams, type LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { roundupQueryOptions, useRoundup } from '../../features/roundups/api/get-roundup';
import { chartsQueryOptions, useApproveChart, useCharts, useChartSettings } from '../../features/editorial/api/charts';
import { ChartCard } from '../../features/editorial/components/chart-card';
import { EditorialNav } from '../../features/editorial/components/editorial-nav';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';
import { editorialDeciders, may } from '../../../shared/access/roles';

function roundupIdFrom(value: string | undefined): number {
  const id = Number(value);
  if (!Number.isInteger(id) || id <= 0) throw new Response('Not found', { status: 404 });
  return id;
}

export function loader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    const id = roundupIdFrom(params.id);
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (!user || !canOpen(paths.roundups, user.role)) return null;
    await Promise.all([
      queryClient.ensureQueryData(roundupQueryOptions(id)),
      queryClient.ensureQueryData(chartsQueryOptions(id)),
    ]);
    return null;
  };
}

export function Component() {
  return (
    <RoleGate path={paths.roundups} pageName="Charts">
      <ChartsPage />
    </RoleGate>
  );
}

function ChartsPage() {
  const roundupId = roundupIdFrom(useParams().id);
  const user = useSession();
  const roundup = useRoundup(roundupId);
  const charts = useCharts(roundupId);
  const approve = useApproveChart(roundupId);
  const settings = useChartSettings(roundupId);
  const { hash } = useLocation();
  useEffect(() => {
    if (hash) document.getElementById(hash.slice(1))?.scrollIntoView();
  }, [hash]);
  if (!user) return null;
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
