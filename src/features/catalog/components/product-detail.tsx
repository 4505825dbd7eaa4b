import { useState } from 'react';
import { Link, useLocation, useNavigate } from 'react-router';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button, buttonStyles } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { DateTime } from '../../../components/ui/date-time';
import { PageHeader } from '../../../components/ui/page-header';
import { Panel } from '../../../components/ui/panel';
import { isApiError } from '../../../lib/api-client';
import { describeSubmitError } from '../../../lib/form-errors';
import { userTimeZone } from '../../../lib/format-time';
import { paths } from '../../../lib/paths';
import { roundupStateLabels } from '../../../../shared/domain/planning/roundup-states';
import { useProduct } from '../api/get-product';
import { useDeleteProduct, useUpdateProduct } from '../api/save-product';
import { AddPriceForm } from './add-price-form';
import { formatFormFactor } from './catalog-format';
import { PriceHistory } from './price-history';
import { ProductSpec } from './product-spec';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';
import { CatalogBreadcrumb } from './catalog-breadcrumb';

export interface ProductDetailViewProps {
  productId: number;
  /** Editors and bench testers edit, archive and add prices. */
  canEdit: boolean;
  /** Editors delete products and price entries. */
  canDelete: boolean;
}

type DeleteStep = { kind: 'closed' } | { kind: 'confirm' } | { kind: 'refused'; message: string };

export function ProductDetailView({ productId, canEdit, canDelete }: ProductDetailViewProps) {
  const product = useProduct(productId);
  const location = useLocation();
  const navigate = useNavigate();
  const updateProduct = useUpdateProduct();
  const deleteProduct = useDeleteProduct();
  const [deleteStep, setDeleteStep] = useState<DeleteStep>({ kind: 'closed' });
  const [deleteError, setDeleteError] = useState<string | undefined>();
  const [archiveMessage, setArchiveMessage] = useState<{ tone: 'success' | 'danger'; text: string } | null>(null);
  const notice = (location.state as { notice?: string } | null)?.notice;
  const name = productDisplayName(product);

  const latestIds = new Set(product.latestPrices.map((price) => price.id));
  const knownRegions = [...new Set(product.prices.map((price) => price.region))].sort();
  const knownCurrencies = [...new Set(['EUR', 'GBP', 'USD', ...product.prices.map((price) => price.currency)])].sort();

  const setArchived = (archived: boolean, after?: () => void) => {
    setArchiveMessage(null);
    updateProduct.mutate(
      { id: product.id, changes: { archived } },
      {
        onSuccess: () => {
          setArchiveMessage({
            tone: 'success',
            text: archived
              ? `${name} is archived: it is hidden from the catalog list and from roundup suggestions.`
              : `${name} is back in the catalog.`,
          });
          after?.();
        },
        onError: (error) => setArchiveMessage({ tone: 'danger', text: describeSubmitError(error).message }),
      },
    );
  };

  const confirmDelete = () => {
    setDeleteError(undefined);
    deleteProduct.mutate(product.id, {
      onSuccess: () => navigate(paths.catalog, { state: { notice: `${name} was deleted from the catalog.` } }),
      onError: (error) => {
        if (isApiError(error) && error.status === 409) setDeleteStep({ kind: 'refused', message: error.message });
        else setDeleteError(describeSubmitError(error).message);
      },
    });
  };

  return (
    <>
      <CatalogBreadcrumb current={product.model} />
      <PageHeader
        eyebrow={`${product.platform} · ${product.socket} · ${product.chipset} · ${formatFormFactor(product.formFactor)}`}
        title={name}
        description={
          <span className="flex flex-wrap items-center gap-2">
            {product.archived && <Badge tone="muted">Archived</Badge>}
            <span>
              Last changed <DateTime value={product.updatedAt} /> ({userTimeZone()})
            </span>
          </span>
        }
        actions={
          canEdit ? (
            <>
              <Link to={paths.catalogProductEdit(product.id)} className={buttonStyles('primary')}>
                Edit product
              </Link>
              <Button onClick={() => setArchived(!product.archived)} pending={updateProduct.isPending}>
                {product.archived ? 'Restore to catalog' : 'Archive'}
              </Button>
              {canDelete && (
                <Button
                  variant="danger"
                  onClick={() => {
                    setDeleteError(undefined);
                    setDeleteStep({ kind: 'confirm' });
                  }}
                >
                  Delete
                </Button>
              )}
            </>
          ) : undefined
        }
      />

      {notice && !archiveMessage && (
        <Alert tone="success" announce className="mb-4">
          {notice}
        </Alert>
      )}
      {archiveMessage && (
        <Alert tone={archiveMessage.tone} announce className="mb-4">
          {archiveMessage.text}
        </Alert>
      )}

      <ProductSpec product={product} />

      <div className="mt-5 grid grid-cols-1 gap-5 lg:grid-cols-[3fr_2fr]">
        <Panel
          title="Price history"
          description="Every price seen, per region, newest first. The list shows the latest by date seen."
        >
          <PriceHistory
            productId={product.id}
            productName={name}
            prices={product.prices}
            latestIds={latestIds}
            canRemove={canDelete}
          />
        </Panel>
        <div className="space-y-5">
          {canEdit && (
            <Panel title="Add a price" description="A new entry in the history; earlier prices stay.">
              <AddPriceForm productId={product.id} knownRegions={knownRegions} knownCurrencies={knownCurrencies} />
            </Panel>
          )}
          <Panel title="In roundups">
            {product.roundups.length === 0 ? (
              <p className="text-sm text-muted">Not in any roundup yet.</p>
            ) : (
              <ul className="space-y-1.5 text-sm">
                {product.roundups.map((use) => (
                  <li key={`${use.roundupId}-${use.kind}`} className="flex flex-wrap items-center gap-2">
                    <Link
                      to={paths.roundup(use.roundupId)}
                      className="font-medium underline decoration-edge underline-offset-2 hover:decoration-copper"
                    >
                      {use.title}
                    </Link>
                    <Badge tone="neutral">{roundupStateLabels[use.state]}</Badge>
                    <span className="text-muted">{use.kind === 'tested' ? 'tested' : 'reference'}</span>
                  </li>
                ))}
              </ul>
            )}
          </Panel>
        </div>
      </div>

      <ConfirmDialog
        open={deleteStep.kind === 'confirm'}
        title={`Delete ${name}?`}
        confirmLabel="Delete product"
        pending={deleteProduct.isPending}
        error={deleteError}
        onCancel={() => setDeleteStep({ kind: 'closed' })}
        onConfirm={confirmDelete}
      >
        <p>The product and its price history leave the catalog for good. The audit log keeps a record.</p>
        {!product.deletable && (
          <p>It is in a roundup, so the server will most likely refuse; archiving hides it and keeps its history.</p>
        )}
      </ConfirmDialog>
      <ConfirmDialog
        open={deleteStep.kind === 'refused'}
        title="This product cannot be deleted"
        confirmLabel="Archive instead"
        cancelLabel="Keep it as it is"
        tone="primary"
        pending={updateProduct.isPending}
        onCancel={() => setDeleteStep({ kind: 'closed' })}
        onConfirm={() => setArchived(true, () => setDeleteStep({ kind: 'closed' }))}
      >
        <p role="alert">{deleteStep.kind === 'refused' ? deleteStep.message : ''}</p>
        <p>Archiving hides it from the catalog list and from roundup suggestions; roundups that use it keep it.</p>
      </ConfirmDialog>
    </>
  );
}
