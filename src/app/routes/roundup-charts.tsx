import { countOf } from '../../lib/plural';
import { chartsQueryOptions, useApproveChart, useCharts, useChartSettings } from '../../features/editorial/api/charts';
import { ChartCard } from '../../features/editorial/components/chart-card';
import { editorialDeciders, may } from '../../../shared/access/roles';
import { roundupRoute, type RoundupPageProps } from '../page-route';
import { EditorialPage, useScrollToHash } from '../editorial-page';

export const { loader, Component } = roundupRoute({ pageName: 'Charts' }, chartsQueryOptions, ChartsPage);

function ChartsPage({ user, roundupId }: RoundupPageProps) {
  const charts = useCharts(roundupId);
  const approve = useApproveChart(roundupId);
  const settings = useChartSettings(roundupId);
  useScrollToHash();
  const canDecide = charts.editable && may(user.role, editorialDeciders);
  const open = charts.charts.filter((c) => c.status === 'not-approved' || c.status === 'stale').length;
  return (
    <EditorialPage
      roundupId={roundupId}
      title="Charts"
      description={
        open === 0
          ? 'Every chart with something to draw is approved.'
          : `${countOf(open, 'chart', 'charts')} to approve. Approving freezes exactly what the chart shows; a later change to a run of record, its analysis, the rubric, the references or a price marks it stale.`
      }
    >
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
    </EditorialPage>
  );
}
