import { useCallback, useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { Panel } from '../../../components/ui/panel';
import { describeSubmitError } from '../../../lib/form-errors';
import type { ProductBrief } from '../../../../shared/schemas/catalog';
import type { RoundupDetail, RoundupEntry } from '../../../../shared/schemas/roundups';
import { useAddEntry } from '../api/add-entry';
import { useRemoveEntry } from '../api/remove-entry';
import { AddProducts } from './add-products';
import { EntriesTable } from './entries-table';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';

export interface ProductsPanelProps {
  roundup: RoundupDetail;
  /** Editors add and remove products (while the plan may change). */
  canEdit: boolean;
}

type Notice = { tone: 'success' | 'warning' | 'danger'; title: string; lines: string[] } | null;

/** The roundup's products with their price checks and samples, and (for editors) the ways to add more. */
export function ProductsPanel({ roundup, canEdit }: ProductsPanelProps) {
  const addEntry = useAddEntry();
  const removeEntry = useRemoveEntry();
  const [notice, setNotice] = useState<Notice>(null);
  const [removing, setRemoving] = useState<RoundupEntry | null>(null);
  const [removeError, setRemoveError] = useState<string | undefined>();
  const editable = canEdit && roundup.planEditable;

  const add = (product: ProductBrief, kind: 'tested' | 'reference', referenceRoundupId?: number) => {
    setNotice(null);
    const name = productDisplayName(product);
    addEntry.mutate(
      { roundupId: roundup.id, entry: { productId: product.id, kind, referenceRoundupId: referenceRoundupId ?? null } },
      {
        onSuccess: ({ warnings }) =>
          setNotice(
            warnings.length > 0
              ? { tone: 'warning', title: `${name} was added, with a warning`, lines: warnings }
              : {
                  tone: 'success',
                  title: kind === 'reference' ? `${name} was added as a reference.` : `${name} was added.`,
                  lines: [],
                },
          ),
        onError: (error) =>
          setNotice({ tone: 'danger', title: `${name} was not added`, lines: [describeSubmitError(error).message] }),
      },
    );
  };

  const startRemoving = useCallback((entry: RoundupEntry) => {
    setRemoveError(undefined);
    setRemoving(entry);
  }, []);

  const confirmRemove = () => {
    if (!removing) return;
    const name = productDisplayName(removing.product);
    removeEntry.mutate(
      { roundupId: roundup.id, entryId: removing.id },
      {
        onSuccess: () => {
          setRemoving(null);
          setNotice({ tone: 'success', title: `${name} left the roundup.`, lines: [] });
        },
        onError: (error) => setRemoveError(describeSubmitError(error).message),
      },
    );
  };

  return (
    <div className="space-y-5">
      {notice && (
        <Alert tone={notice.tone} title={notice.title} announce>
          {notice.lines.length > 0 && (
            <ul className="space-y-0.5">
              {notice.lines.map((line) => (
                <li key={line}>{line}</li>
              ))}
            </ul>
          )}
        </Alert>
      )}

      <EntriesTable roundupId={roundup.id} entries={roundup.entries} onRemove={editable ? startRemoving : undefined} />

      {editable && (
        <Panel title="Add products" description="Tested products get a row in the matrix and a sample record.">
          <AddProducts
            roundup={roundup}
            pendingProductId={addEntry.isPending ? addEntry.variables?.entry.productId : undefined}
            onAdd={add}
          />
        </Panel>
      )}
      {canEdit && !roundup.planEditable && (
        <Alert>The roundup has left the bench, so its products no longer change.</Alert>
      )}

      <ConfirmDialog
        open={removing !== null}
        title={removing ? `Remove ${productDisplayName(removing.product)}?` : 'Remove product?'}
        confirmLabel="Remove from roundup"
        pending={removeEntry.isPending}
        error={removeError}
        onConfirm={confirmRemove}
        onCancel={() => setRemoving(null)}
      >
        <p>
          Its matrix row and sample record go with it. Products whose cells are already running or have results cannot
          be removed.
        </p>
      </ConfirmDialog>
    </div>
  );
}
