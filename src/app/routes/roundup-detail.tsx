import { Suspense } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { Link, useLocation, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { Alert } from '../../components/ui/alert';
import { buttonStyles } from '../../components/ui/button';
import { LoadingState } from '../../components/ui/loading-state';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { benchProfilesQueryOptions } from '../../features/roundups/api/get-bench-profiles';
import { loadConfigurationsQueryOptions } from '../../features/roundups/api/get-load-configurations';
import { roundupQueryOptions, useRoundup } from '../../features/roundups/api/get-roundup';
import { DetailTabs } from '../../features/roundups/components/detail-tabs';
import { ProductsPanel } from '../../features/roundups/components/products-panel';
import { RoundupHeader } from '../../features/roundups/components/roundup-header';
import { RoundupEditorialLinks } from '../../features/editorial/components/roundup-editorial-links';
import { TestPlanPanel } from '../../features/roundups/components/test-plan-panel';
import { PublishingPanel } from '../../features/roundups/components/publishing-panel';
import { matrixQueryOptions } from '../../features/matrix/api/get-matrix';
import { MatrixGrid } from '../../features/matrix/components/matrix-grid';
import { ResultsMatrix } from '../../features/test-runs/components/results-matrix';
import { productName } from '../../lib/product-name';
import { SamplesTable } from '../../features/samples/components/samples-table';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';
import { benchWorkers, may, planEditors } from '../../../shared/access/roles';
import { writeUpReadableStates } from '../../../shared/domain/editorial/write-up-availability';

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
    const wanted: Promise<unknown>[] = [
      queryClient.ensureQueryData(roundupQueryOptions(id)),
      queryClient.ensureQueryData(matrixQueryOptions(id)),
    ];
    if (may(user.role, planEditors)) {
      // Warm, not awaited: only the test-plan editor needs them.
      void queryClient.prefetchQuery(benchProfilesQueryOptions());
      void queryClient.prefetchQuery(loadConfigurationsQueryOptions());
    }
    await Promise.all(wanted);
    return null;
  };
}

export function Component() {
  return (
    <RoleGate path={paths.roundups} pageName="Roundup">
      <RoundupPage />
    </RoleGate>
  );
}

const tabIds = ['products', 'matrix', 'results', 'samples', 'plan', 'publishing'] as const;

function RoundupPage() {
  const params = useParams();
  const roundupId = roundupIdFrom(params.id);
  const user = useSession();
  const roundup = useRoundup(roundupId);
  const location = useLocation();
  const [search, setSearch] = useSearchParams();
  if (!user) return null;

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
                  .map((entry) => ({ entryId: entry.id, name: productName(entry.product) }))}
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
              </Suspense>
            ),
          },
        ]}
      />
    </>
  );
}
