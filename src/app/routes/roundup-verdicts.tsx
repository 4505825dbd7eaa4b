import { useEffect } from 'react';
import { useLocation, useParams } from 'react-router';
import { PageHeader } from '../../components/ui/page-header';
import { addressId } from '../../lib/address-id';
import { paths } from '../../lib/paths';
import { useRoundup } from '../../features/roundups/api/get-roundup';
import { useSetVerdict, useVerdicts, verdictsQueryOptions } from '../../features/editorial/api/verdicts';
import { EditorialNav } from '../../features/editorial/components/editorial-nav';
import { VerdictCard } from '../../features/editorial/components/verdict-card';
import { editorialDeciders, may } from '../../../shared/access/roles';
import type { CurrentUser } from '../../../shared/schemas/auth';
import { gatedPage, roundupPageLoader } from '../page-route';
import { EmptyState } from '../../components/ui/empty-state';

export const loader = roundupPageLoader((queryClient, id) => [queryClient.ensureQueryData(verdictsQueryOptions(id))]);

export const Component = gatedPage({ path: paths.roundups, pageName: 'Verdicts' }, VerdictsPage);

function VerdictsPage({ user }: { user: CurrentUser }) {
  const roundupId = addressId(useParams().id);
  const roundup = useRoundup(roundupId);
  const verdicts = useVerdicts(roundupId);
  const save = useSetVerdict(roundupId);
  // The readiness list links to a product's verdict (#verdict-<entry>).
  const { hash } = useLocation();
  useEffect(() => {
    if (hash) document.getElementById(hash.slice(1))?.scrollIntoView();
  }, [hash]);
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
