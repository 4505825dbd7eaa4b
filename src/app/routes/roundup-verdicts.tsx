import type { QueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { useLocation, useParams, type LoaderFunctionArgs } from 'react-router';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { roundupQueryOptions, useRoundup } from '../../features/roundups/api/get-roundup';
import { useSetVerdict, useVerdicts, verdictsQueryOptions } from '../../features/editorial/api/verdicts';
import { EditorialNav } from '../../features/editorial/components/editorial-nav';
import { VerdictCard } from '../../features/editorial/components/verdict-card';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';
import { editorialDeciders, may } from '../../../shared/access/roles';
import { EmptyState } from '../../components/ui/empty-state';

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
      queryClient.ensureQueryData(verdictsQueryOptions(id)),
    ]);
    return null;
  };
}

export function Component() {
  return (
    <RoleGate path={paths.roundups} pageName="Verdicts">
      <VerdictsPage />
    </RoleGate>
  );
}

function VerdictsPage() {
  const roundupId = roundupIdFrom(useParams().id);
  const user = useSession();
  const roundup = useRoundup(roundupId);
  const verdicts = useVerdicts(roundupId);
  const save = useSetVerdict(roundupId);
  // The readiness list links to a product's verdict (#verdict-<entry>).
  const { hash } = useLocation();
  useEffect(() => {
    if (hash) document.getElementById(hash.slice(1))?.scrollIntoView();
  }, [hash]);
  if (!user) return null;
  const editable = verdicts.editable && may(user.role, editorialDeciders);
  return (
    <>
      <PageHeader
        eyebrow={roundup.title}
        title="Verdicts"
        description="The editor’s label per product, with the rubric verdicts of its runs of record beside it. A label that goes against them needs a written reason."
      />
      <EditorialNav roundupId={roundupId} />
      {verdicts.products.length === 0 ? (
        <EmptyState title="No tested products">Add products to the roundup first.</EmptyState>
      ) : (
        <div className="space-y-4">
          {verdicts.products.map((product) => (
            <VerdictCard
              key={product.entryId}
              product={product}
              currency={verdicts.currency}
              editable={editable}
              saving={save.isPending && save.variables?.entryId === product.entryId}
              onSave={(body) => save.mutateAsync({ entryId: product.entryId, body })}
            />
          ))}
        </div>
      )}
    </>
  );
}
