import { Suspense } from 'react';
import { Link, useLocation, useSearchParams } from 'react-router';
import { Alert } from '../../components/ui/alert';
import { buttonStyles } from '../../components/ui/button';
import { LoadingState } from '../../components/ui/loading-state';
import { paths } from '../../lib/paths';
import { useRoundup } from '../../features/roundups/api/get-roundup';
import { benchProfilesQueryOptions } from '../../features/roundups/api/bench-profiles';
import { loadConfigurationsQueryOptions } from '../../features/roundups/api/load-configurations';
import { DetailTabs } from '../../features/roundups/components/detail-tabs';
import { ProductsPanel } from '../../features/roundups/components/products-panel';
import { RoundupHeader } from '../../features/roundups/components/roundup-header';
import { RoundupEditorialLinks } from '../../features/editorial/components/roundup-editorial-links';
import { TestPlanPanel } from '../../features/roundups/components/test-plan-panel';
import { PublishingPanel } from '../../features/roundups/components/publishing-panel';
import { OpenDataPanel } from '../../features/roundups/components/open-data-panel';
import { matrixQueryOptions } from '../../features/matrix/api/get-matrix';
import { MatrixGrid } from '../../features/matrix/components/matrix-grid';
import { ResultsMatrix } from '../../features/test-runs/components/results-matrix';
import { productDisplayName } from '../../../shared/domain/planning/product-display-name';
import { SamplesTable } from '../../features/samples/components/samples-table';
import { benchWorkers, may, openDataSettingsEditors, planEditors } from '../../../shared/access/roles';
import { writeUpReadableStates } from '../../../shared/domain/editorial/write-up-availability';
import { roundupPage, roundupPageLoader, type RoundupPageProps } from '../page-route';

export const loader = roundupPageLoader((queryClient, id, _args, user) => {
  if (may(user.role, planEditors)) {
    // Warm, not awaited: only the test-plan editor needs them.
    void queryClient.prefetchQuery(benchProfilesQueryOptions());
    void queryClient.prefetchQuery(loadConfigurationsQueryOptions());
  }
  return [queryClient.ensureQueryData(matrixQueryOptions(id))];
});

export const Component = roundupPage({ pageName: 'Roundup' }, RoundupPage);

const tabIds = ['products', 'matrix', 'results', 'samples', 'plan', 'publishing'] as const;

function RoundupPage({ user, roundupId }: RoundupPageProps) {
  const roundup = useRoundup(roundupId);
  const location = useLocation();
  const [search, setSearch] = useSearchParams();

  const requested = search.get('tab');
  const tab = tabIds.find((id) => id === requested) ?? 'products';
  const isEditor = may(user.role, planEditors);
  const justCreated = (location.state as { created?: boolean } | null)?.created === true;

  return (
    <>
      <p className="mb-2 text-sm">
        <Link to={paths.roundups} className="text-copper underline-offset-2 hover:underline">
          ← All roundups
        </Link>
      </p>
      <RoundupHeader roundup={roundup} canChangeState={isEditor} />
      {writeUpReadableStates.includes(roundup.state) && (
        <p className="mb-4">
          <Link to={paths.writeUp(roundup.id)} className={buttonStyles('secondary')}>
            Write-up
          </Link>
        </p>
      )}
      <RoundupEditorialLinks roundupId={roundup.id} state={roundup.state} />
      {justCreated && roundup.entries.length === 0 && (
        <Alert tone="success" title="The roundup is planned" className="mb-5">
          Next, add the products to compare: the catalog suggests boards inside the price band.
        </Alert>
      )}
      <DetailTabs
        label="Roundup sections"
        selected={tab}
        onSelect={(id) => setSearch(id === 'products' ? {} : { tab: id }, { replace: true, preventScrollReset: true })}
        tabs={[
          {
            id: 'products',
            label: 'Products',
            badge: <span className="numeric font-normal text-muted">{roundup.entries.length}</span>,
            content: <ProductsPanel roundup={roundup} canEdit={isEditor} />,
          },
          {
            id: 'matrix',
            label: 'Matrix',
            badge: (
              <span className="numeric font-normal text-muted">{`${roundup.progress.percentAccepted}\u2009%`}</span>
            ),
            content: (
              <Suspense fallback={<LoadingState label="Loading the matrix…" />}>
                <MatrixGrid roundupId={roundup.id} canAssign={isEditor} viewer={user} />
              </Suspense>
            ),
          },
          {
            id: 'results',
            label: 'Results',
            content: (
              <ResultsMatrix
                roundupId={roundup.id}
                rows={roundup.entries
                  .filter((entry) => entry.kind === 'tested')
                  .map((entry) => ({ entryId: entry.id, name: productDisplayName(entry.product) }))}
                columns={roundup.loadConfigurations.map((configuration) => ({
                  id: configuration.id,
                  name: configuration.name,
                }))}
                cellPath={(cellId) => paths.roundupCell(roundup.id, cellId)}
                canEditRubric={isEditor}
              />
            ),
          },
          {
            id: 'samples',
            label: 'Samples',
            badge:
              roundup.overdueSampleCount > 0 ? (
                <span className="text-xs font-semibold text-red">{roundup.overdueSampleCount} overdue</span>
              ) : undefined,
            content: (
              <Suspense fallback={<LoadingState label="Loading samples…" />}>
                <SamplesTable
                  roundupId={roundup.id}
                  canEdit={may(user.role, benchWorkers)}
                  defaultCurrency={roundup.priceBand.currency}
                />
              </Suspense>
            ),
          },
          {
            id: 'plan',
            label: 'Test plan',
            badge:
              roundup.planWarnings.length > 0 ? (
                <span className="text-xs font-semibold text-amber">! {roundup.planWarnings.length}</span>
              ) : undefined,
            content: (
              <Suspense fallback={<LoadingState label="Loading the test plan…" />}>
                <TestPlanPanel roundup={roundup} canEdit={isEditor} />
              </Suspense>
            ),
          },
          {
            id: 'publishing',
            label: 'Publishing',
            content: (
              <Suspense fallback={<LoadingState label="Loading publishing…" />}>
                <PublishingPanel roundupId={roundup.id} defaultTimeZone={roundup.timeZone} canEdit={isEditor} />
                {may(user.role, openDataSettingsEditors) && (
                  <div className="mt-5">
                    <OpenDataPanel roundupId={roundup.id} />
                  </div>
                )}
              </Suspense>
            ),
          },
        ]}
      />
    </>
  );
}
