import { useEffect, useRef, useState } from 'react';
import { useSearchParams } from 'react-router';
import { Button } from '../../../components/ui/button';
import { Checkbox } from '../../../components/ui/checkbox';
import { SearchField } from '../../../components/ui/search-field';
import { Select } from '../../../components/ui/select';
import {
  formFactorLabels,
  formFactors,
  vcoreStageTypeLabels,
  vcoreStageTypes,
  type ProductList,
} from '../../../../shared/schemas/catalog';
import { filterParamNames, hasActiveFilters, type FilterParamName } from './catalog-search-params';

const SEARCH_DELAY_MS = 300;

const toOptions = (values: readonly string[]) => values.map((value) => ({ value, label: value }));

/** Search and filters above the catalog table; every change is written to the address. */
export function CatalogFilters({ facets }: { facets: ProductList['facets'] }) {
  const [params, setParams] = useSearchParams();
  const urlSearch = params.get('q') ?? '';
  const [search, setSearch] = useState(urlSearch);
  const [seenUrlSearch, setSeenUrlSearch] = useState(urlSearch);
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);

  useEffect(() => () => clearTimeout(timer.current), []);

  // Back/Forward or "Clear" changes the address: follow it, unless it is the search this box just sent.
  if (urlSearch !== seenUrlSearch) {
    setSeenUrlSearch(urlSearch);
    if (urlSearch !== search.trim()) setSearch(urlSearch);
  }

  const update = (name: FilterParamName, value: string) => {
    setParams(
      (current) => {
        const next = new URLSearchParams(current);
        if (value) next.set(name, value);
        else next.delete(name);
        return next;
      },
      { replace: name === 'q', preventScrollReset: true },
    );
  };

  const typeSearch = (value: string) => {
    setSearch(value);
    clearTimeout(timer.current);
    timer.current = setTimeout(() => update('q', value.trim()), SEARCH_DELAY_MS);
  };

  const clear = () => {
    clearTimeout(timer.current);
    setSearch('');
    setParams(
      (current) => {
        const next = new URLSearchParams(current);
        for (const name of filterParamNames) next.delete(name);
        return next;
      },
      { preventScrollReset: true },
    );
  };

  const select = (name: FilterParamName, label: string, values: readonly { value: string; label: string }[]) => (
    <Select
      label={label}
      required={false}
      options={values}
      placeholder="Any"
      value={params.get(name) ?? ''}
      onChange={(event) => update(name, event.target.value)}
      className="min-w-0"
    />
  );

  return (
    <div
      role="search"
      aria-label="Catalog filters"
      className="mb-4 rounded-[3px] border border-rule bg-surface px-4 py-3"
    >
      <div className="grid grid-cols-2 gap-3 lg:grid-cols-4">
        <SearchField
          label="Search"
          value={search}
          onChange={(event) => typeSearch(event.target.value)}
          onKeyDown={(event) => {
            if (event.key === 'Enter') {
              clearTimeout(timer.current);
              update('q', search.trim());
            }
          }}
          placeholder="Maker, model, chipset, controller, stage part"
          className="col-span-2"
        />
        {select('maker', 'Maker', toOptions(facets.makers))}
        {select('platform', 'Platform', toOptions(facets.platforms))}
        {select('chipset', 'Chipset', toOptions(facets.chipsets))}
        {select(
          'formFactor',
          'Form factor',
          formFactors.map((value) => ({ value, label: formFactorLabels[value] })),
        )}
        {select(
          'stageType',
          'Stage type',
          vcoreStageTypes.map((value) => ({ value, label: vcoreStageTypeLabels[value] })),
        )}
        <div className="col-span-2 flex flex-wrap items-end justify-between gap-x-3 gap-y-1 pb-1.5 lg:col-span-1">
          <Checkbox
            label="Include archived"
            checked={params.get('archived') === 'include'}
            onChange={(event) => update('archived', event.target.checked ? 'include' : '')}
          />
          {(hasActiveFilters(params) || search) && (
            <Button size="sm" variant="quiet" onClick={clear}>
              Clear all
            </Button>
          )}
        </div>
      </div>
    </div>
  );
}
