import { formFactors, vcoreStageTypes } from '../../../../shared/schemas/catalog';
import type { ProductFilters } from '../api/get-products';

/** The catalog's filters live in the address (?q=…&maker=…), so a filtered list can be shared and Back works. */
export const filterParamNames = ['q', 'maker', 'platform', 'chipset', 'formFactor', 'stageType', 'archived'] as const;
export type FilterParamName = (typeof filterParamNames)[number];

const oneOf = <T extends string>(allowed: readonly T[], value: string | null): T | undefined =>
  value && (allowed as readonly string[]).includes(value) ? (value as T) : undefined;

export function filtersFromSearchParams(params: URLSearchParams): ProductFilters {
  const text = (name: FilterParamName) => params.get(name)?.trim() || undefined;
  return {
    search: text('q')?.slice(0, 100),
    maker: text('maker'),
    platform: text('platform'),
    chipset: text('chipset'),
    formFactor: oneOf(formFactors, params.get('formFactor')),
    vcoreStageType: oneOf(vcoreStageTypes, params.get('stageType')),
    archived: oneOf(['include', 'only'] as const, params.get('archived')) ?? 'exclude',
  };
}

export function hasActiveFilters(params: URLSearchParams): boolean {
  return filterParamNames.some((name) => Boolean(params.get(name)));
}
