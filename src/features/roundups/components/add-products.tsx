import { useDeferredValue, useId, useState, type ReactNode } from 'react';
import { Button } from '../../../components/ui/button';
import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import { formatMoney } from '../../../../shared/domain/planning/money';
import { roundupStateLabels } from '../../../../shared/domain/planning/roundup-states';
import type { ProductBrief } from '../../../../shared/schemas/catalog';
import type { RoundupDetail } from '../../../../shared/schemas/roundups';
import { useCatalogProducts } from '../api/get-catalog-products';
import { useReferenceCandidates } from '../api/get-reference-candidates';
import { useSuggestions } from '../api/get-suggestions';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';
import { formatBand } from './planning-format';
import { PriceCheckCell } from './price-check-cell';

export interface AddProductsProps {
  roundup: RoundupDetail;
  /** The product being added, to show its button as busy. */
  pendingProductId: number | undefined;
  onAdd: (product: ProductBrief, kind: 'tested' | 'reference', referenceRoundupId?: number) => void;
}

/** Three ways in: the catalog's in-band suggestions, any catalog product by search, or a reference entry. */
export function AddProducts({ roundup, pendingProductId, onAdd }: AddProductsProps) {
  return (
    <div className="grid gap-5 lg:grid-cols-2">
      <Suggestions roundup={roundup} pendingProductId={pendingProductId} onAdd={onAdd} />
      <div className="space-y-5">
        <CatalogSearch roundup={roundup} pendingProductId={pendingProductId} onAdd={onAdd} />
        <ReferencePicker roundup={roundup} pendingProductId={pendingProductId} onAdd={onAdd} />
      </div>
    </div>
  );
}

/** One way in: a titled section with a line on what it offers. */
function AddSection({ title, intro, children }: { title: string; intro: ReactNode; children: ReactNode }) {
  const headingId = useId();
  return (
    <section aria-labelledby={headingId}>
      <h3 id={headingId} className="text-sm font-semibold text-ink">
        {title}
      </h3>
      <p className="mt-0.5 text-[0.8125rem] text-muted">{intro}</p>
      {children}
    </section>
  );
}

/** Products that can join the roundup, each with a line of detail, what it costs and its Add button. */
function ProductChoices<Item>({
  items,
  productOf,
  detail,
  price,
  className,
  pendingProductId,
  onAdd,
}: {
  items: readonly Item[];
  productOf: (item: Item) => ProductBrief;
  detail: (item: Item) => ReactNode;
  price: (item: Item) => ReactNode;
  className: string;
} & Pick<AddProductsProps, 'pendingProductId' | 'onAdd'>) {
  return (
    <ul className={`${className} divide-y divide-rule rounded-[3px] border border-rule`}>
      {items.map((item) => {
        const product = productOf(item);
        return (
          <li key={product.id} className="flex flex-wrap items-center gap-x-3 gap-y-2 px-3 py-2">
            <div className="min-w-0 flex-1 basis-48">
              <p className="font-medium">{productDisplayName(product)}</p>
              <p className="text-xs text-muted">{detail(item)}</p>
            </div>
            {price(item)}
            <Button
              size="sm"
              onClick={() => onAdd(product, 'tested')}
              pending={pendingProductId === product.id}
              aria-label={`Add ${productDisplayName(product)}`}
            >
              Add
            </Button>
          </li>
        );
      })}
    </ul>
  );
}

function Suggestions({ roundup, pendingProductId, onAdd }: AddProductsProps) {
  const suggestions = useSuggestions(roundup.id, true);
  const list = suggestions.data?.suggestions ?? [];
  return (
    <AddSection
      title="Suggested from the catalog"
      intro={
        <>
          {roundup.platform} boards whose latest price in {roundup.priceBand.region} is inside{' '}
          {formatBand(roundup.priceBand)}, cheapest first.
        </>
      }
    >
      {suggestions.isPending ? (
        <p className="mt-3 text-sm text-muted" role="status">
          Looking through the catalog…
        </p>
      ) : suggestions.isError ? (
        <p className="mt-3 text-sm text-red" role="alert">
          The suggestions could not be loaded: {suggestions.error.message}
        </p>
      ) : list.length === 0 ? (
        <p className="mt-3 rounded-[3px] border border-dashed border-edge px-3 py-3 text-sm text-muted">
          No other catalog product of this platform has a current price inside the band. Search the catalog to add one
          anyway.
        </p>
      ) : (
        <ProductChoices
          items={list}
          productOf={(suggestion) => suggestion.product}
          detail={(suggestion) => suggestion.product.chipset}
          price={(suggestion) => <PriceCheckCell check={suggestion.priceCheck} />}
          className="mt-3"
          pendingProductId={pendingProductId}
          onAdd={onAdd}
        />
      )}
    </AddSection>
  );
}

function CatalogSearch({ roundup, pendingProductId, onAdd }: AddProductsProps) {
  const [search, setSearch] = useState('');
  const deferred = useDeferredValue(search.trim());
  const enabled = deferred.length >= 2;
  const results = useCatalogProducts({ search: deferred, priceRegion: roundup.priceBand.region, limit: 20 }, enabled);
  const inRoundup = new Set(roundup.entries.map((e) => e.product.id));
  const products = (results.data?.products ?? []).filter((p) => !inRoundup.has(p.id));
  const region = roundup.priceBand.region;
  return (
    <AddSection
      title="Any catalog product"
      intro="Outside the band or without a current price? It can still join; you will see why it was not suggested."
    >
      <TextField
        label="Search the catalog"
        type="search"
        value={search}
        onChange={(event) => setSearch(event.target.value)}
        placeholder="Maker, model or chipset"
        optional
        autoComplete="off"
        className="mt-3"
      />
      {enabled && (
        <div aria-live="polite">
          {results.isPending ? (
            <p className="mt-2 text-sm text-muted">Searching…</p>
          ) : products.length === 0 ? (
            <p className="mt-2 text-sm text-muted">No catalog product outside this roundup matches “{deferred}”.</p>
          ) : (
            <ProductChoices
              items={products}
              productOf={(product) => product}
              detail={(product) => `${product.platform} · ${product.chipset}`}
              price={(product) => {
                const price = product.latestPrices.find((p) => p.region === region);
                return (
                  <span className="numeric">
                    {price ? (
                      formatMoney(price.amountMinor, price.currency)
                    ) : (
                      <span className="text-muted">No {region} price</span>
                    )}
                  </span>
                );
              }}
              className="mt-2"
              pendingProductId={pendingProductId}
              onAdd={onAdd}
            />
          )}
        </div>
      )}
    </AddSection>
  );
}

function ReferencePicker({ roundup, pendingProductId, onAdd }: AddProductsProps) {
  const candidates = useReferenceCandidates(roundup.id, true);
  const [productId, setProductId] = useState('');
  const [earlierId, setEarlierId] = useState('');
  const list = candidates.data ?? [];
  const chosen = list.find((c) => String(c.product.id) === productId);
  return (
    <AddSection
      title="Reference entry"
      intro="A product tested in an earlier roundup, shown in the comparisons with its accepted results. It is not re-tested and has no sample."
    >
      {candidates.isPending ? (
        <p className="mt-2 text-sm text-muted">Loading earlier results…</p>
      ) : list.length === 0 ? (
        <p className="mt-2 rounded-[3px] border border-dashed border-edge px-3 py-3 text-sm text-muted">
          No product has accepted results in an earlier roundup yet.
        </p>
      ) : (
        <div className="mt-3 flex flex-wrap items-end gap-3">
          <Select
            label="Product"
            options={list.map((c) => ({ value: String(c.product.id), label: productDisplayName(c.product) }))}
            placeholder="Choose a product…"
            value={productId}
            onChange={(event) => {
              setProductId(event.target.value);
              setEarlierId('');
            }}
            className="w-full sm:w-64"
          />
          {chosen && (
            <Select
              label="Results from"
              options={chosen.testedIn.map((t) => ({
                value: String(t.roundupId),
                label: `${t.title} (${roundupStateLabels[t.state]})`,
              }))}
              placeholder="The latest roundup"
              optional
              value={earlierId}
              onChange={(event) => setEarlierId(event.target.value)}
              className="w-full sm:w-64"
            />
          )}
          <Button
            disabled={!chosen}
            pending={chosen !== undefined && pendingProductId === chosen.product.id}
            onClick={() => chosen && onAdd(chosen.product, 'reference', earlierId ? Number(earlierId) : undefined)}
          >
            Add as reference
          </Button>
        </div>
      )}
    </AddSection>
  );
}
