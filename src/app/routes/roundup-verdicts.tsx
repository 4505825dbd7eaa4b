import { useSetVerdict, useVerdicts, verdictsQueryOptions } from '../../features/editorial/api/verdicts';
import { VerdictCard } from '../../features/editorial/components/verdict-card';
import { editorialDeciders, may } from '../../../shared/access/roles';
import { roundupRoute, type RoundupPageProps } from '../page-route';
import { EditorialPage, useScrollToHash } from '../editorial-page';
import { EmptyState } from '../../components/ui/empty-state';

export const { loader, Component } = roundupRoute({ pageName: 'Verdicts' }, verdictsQueryOptions, VerdictsPage);

function VerdictsPage({ user, roundupId }: RoundupPageProps) {
  const verdicts = useVerdicts(roundupId);
  const save = useSetVerdict(roundupId);
  // The readiness list links to a product's verdict (#verdict-<entry>).
  useScrollToHash();
  const editable = verdicts.editable && may(user.role, editorialDeciders);
  return (
    <EditorialPage
      roundupId={roundupId}
      title="Verdicts"
      description="The editor’s label per product, with the rubric verdicts of its runs of record beside it. A label that goes against them needs a written reason."
    >
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
    </EditorialPage>
  );
}
