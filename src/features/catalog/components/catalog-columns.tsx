import { Link } from 'react-router';
import { Badge } from '../../../components/ui/badge';
import { buttonStyles } from '../../../components/ui/button';
import type { DataTableColumn } from '../../../components/ui/data-table';
import { DateTime } from '../../../components/ui/date-time';
import { paths } from '../../../lib/paths';
import type { Product } from '../../../../shared/schemas/catalog';
import { formatPrice } from '../../../lib/format-money';
import { formatCalendarDate } from '../../../lib/format-time';
import { countOf } from '../../../lib/plural';
import {
  featureSummary,
  formatAmps,
  formatFormFactor,
  formatFrontUsbC,
  formatLanSpeed,
  formatPhases,
  formatRearUsb,
  formatWifi,
  formatYesNo,
  phasesTitle,
  rearUsbTotal,
  stageTypeLong,
  stageTypeShort,
} from './catalog-format';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';

export interface CatalogColumn extends DataTableColumn<Product> {
  /** Name in the column chooser (the header may be shorter). */
  label: string;
  /** Shown until the user chooses otherwise. */
  defaultVisible: boolean;
}

const muted = (text: string) => (text === '—' ? <span className="text-muted">—</span> : text);
const nowrap = (text: string) => <span className="whitespace-nowrap">{muted(text)}</span>;

type ColumnHead = Pick<CatalogColumn, 'id' | 'header'> & Partial<Pick<CatalogColumn, 'label' | 'hideBelow'>>;

/** Whether a column shows before the user chooses. */
const shown = true;
const hidden = false;

/**
 * A column of words, sorted and filtered by them (or by `sortBy`), kept on one line unless `wraps`; "—" is greyed.
 */
function wordsColumn(
  head: ColumnHead & {
    text: (product: Product) => string;
    sortBy?: (product: Product) => string | number | null;
    wraps?: boolean;
  },
  defaultVisible: boolean,
): CatalogColumn {
  const { text, sortBy = text, wraps = false, ...rest } = head;
  return {
    ...rest,
    label: head.label ?? head.header,
    defaultVisible,
    sortValue: sortBy,
    cell: (product) => (wraps ? muted : nowrap)(text(product)),
  };
}

/** A right-aligned figure sorted by its value; `text` writes it ("—" when not known). */
function figureColumn(
  head: ColumnHead & {
    value: (product: Product) => number | string | null;
    text?: (product: Product) => string;
  },
  defaultVisible: boolean,
): CatalogColumn {
  const { value, text = (product) => String(value(product) ?? '—'), ...rest } = head;
  return {
    ...rest,
    label: head.label ?? head.header,
    defaultVisible,
    numeric: true,
    sortValue: value,
    cell: (product) => muted(text(product)),
  };
}

export function catalogColumns(options: { regions: readonly string[]; canEdit: boolean }): CatalogColumn[] {
  const priceColumns: CatalogColumn[] = options.regions.map((region) => ({
    id: `price:${region}`,
    header: `Price ${region}`,
    label: `Latest price in ${region}`,
    defaultVisible: true,
    numeric: true,
    sortValue: (product) => product.latestPrices.find((price) => price.region === region)?.amountMinor ?? null,
    cell: (product) => {
      const price = product.latestPrices.find((candidate) => candidate.region === region);
      if (!price) return <span className="text-muted">—</span>;
      return (
        <span title={`Seen ${formatCalendarDate(price.observedOn)} at ${price.source}`}>{formatPrice(price)}</span>
      );
    },
  }));

  const columns: CatalogColumn[] = [
    wordsColumn({ id: 'maker', header: 'Maker', hideBelow: 'sm', text: (product) => product.maker }, shown),
    {
      id: 'model',
      header: 'Model',
      label: 'Model',
      defaultVisible: true,
      rowHeader: true,
      sortValue: (product) => product.model,
      cell: (product) => (
        <span className="flex min-w-[9rem] flex-wrap items-center gap-x-2 gap-y-1">
          {/* On phones the maker column is hidden; the maker goes with the model instead. */}
          <span className="block w-full text-xs font-normal text-muted sm:hidden">{product.maker}</span>
          <Link
            to={paths.catalogProduct(product.id)}
            className="text-ink underline decoration-edge underline-offset-2 hover:decoration-copper"
          >
            {product.model}
          </Link>
          {product.archived && <Badge tone="muted">Archived</Badge>}
        </span>
      ),
    },
    wordsColumn(
      {
        id: 'platform',
        header: 'Platform / socket',
        label: 'Platform and socket',
        text: (product) => `${product.platform} · ${product.socket}`,
        sortBy: (product) => `${product.platform} ${product.socket}`,
      },
      shown,
    ),
    wordsColumn({ id: 'chipset', header: 'Chipset', text: (product) => product.chipset }, shown),
    wordsColumn(
      { id: 'formFactor', header: 'Form factor', text: (product) => formatFormFactor(product.formFactor) },
      shown,
    ),
    figureColumn(
      {
        id: 'releaseDate',
        header: 'Released',
        label: 'Release date',
        value: (product) => product.releaseDate,
        text: (product) => (product.releaseDate ? formatCalendarDate(product.releaseDate) : '—'),
      },
      shown,
    ),
    wordsColumn(
      {
        id: 'controller',
        header: 'Controller',
        label: 'V-core controller',
        text: (product) => product.powerDesign.controller ?? '—',
        sortBy: (product) => product.powerDesign.controller,
      },
      shown,
    ),
    {
      id: 'phases',
      header: 'Phases',
      label: 'Phases (controller → effective)',
      defaultVisible: true,
      numeric: true,
      sortValue: (product) => product.powerDesign.effectivePhases,
      filterValue: (product) => formatPhases(product.powerDesign),
      cell: (product) => (
        <span title={phasesTitle(product.powerDesign)}>{muted(formatPhases(product.powerDesign))}</span>
      ),
    },
    {
      id: 'stageType',
      header: 'Stage type',
      label: 'V-core stage type and part',
      defaultVisible: true,
      sortValue: (product) => stageTypeShort(product.powerDesign),
      cell: (product) => (
        <span className="block whitespace-nowrap" title={stageTypeLong(product.powerDesign)}>
          {muted(stageTypeShort(product.powerDesign))}
          {product.powerDesign.vcoreStagePart && (
            <span className="block text-xs text-muted">{product.powerDesign.vcoreStagePart}</span>
          )}
        </span>
      ),
    },
    figureColumn(
      {
        id: 'stageRating',
        header: 'Stage rating',
        label: 'Continuous rating per stage',
        value: (product) => product.powerDesign.vcoreStageCurrentA,
        text: (product) => formatAmps(product.powerDesign.vcoreStageCurrentA, 0),
      },
      shown,
    ),
    figureColumn(
      {
        id: 'ratedSum',
        header: 'Rating sum',
        label: 'V-core stages × rating',
        value: (product) => product.powerDesign.vcoreRatedCurrentA,
        text: ({ powerDesign: { vcoreStageCount, vcoreRatedCurrentA } }) =>
          vcoreRatedCurrentA === null
            ? '—'
            : `${formatAmps(vcoreRatedCurrentA)} (${countOf(vcoreStageCount ?? 0, 'stage', 'stages')})`,
      },
      hidden,
    ),
    figureColumn(
      {
        id: 'socRail',
        header: 'SoC stages',
        label: 'SoC rail stages',
        value: (product) => product.powerDesign.socRailStages,
      },
      hidden,
    ),
    ...priceColumns,
    {
      id: 'features',
      header: 'Features',
      label: 'Features (summary)',
      defaultVisible: true,
      filterValue: (product) => featureSummary(product.features),
      cell: (product) => (
        <span className="block min-w-[18rem] text-[0.8125rem]">{muted(featureSummary(product.features))}</span>
      ),
    },
    wordsColumn(
      {
        id: 'rearUsb',
        header: 'Rear USB',
        label: 'Rear USB by speed',
        text: (product) => formatRearUsb(product.features.rearUsb),
        sortBy: (product) => rearUsbTotal(product.features.rearUsb),
      },
      hidden,
    ),
    wordsColumn(
      {
        id: 'frontUsbC',
        header: 'Front USB-C',
        label: 'Front USB-C header',
        text: (product) => formatFrontUsbC(product.features.frontUsbCHeader),
      },
      hidden,
    ),
    figureColumn(
      {
        id: 'lan',
        header: 'LAN',
        label: 'Wired LAN speed',
        value: (product) => product.features.lanSpeedMbps,
        text: (product) => formatLanSpeed(product.features.lanSpeedMbps),
      },
      hidden,
    ),
    wordsColumn({ id: 'wifi', header: 'Wi-Fi', text: (product) => formatWifi(product.features.wifi) }, hidden),
    figureColumn({ id: 'm2', header: 'M.2', label: 'M.2 slots', value: (product) => product.features.m2Slots }, hidden),
    figureColumn(
      { id: 'sata', header: 'SATA', label: 'SATA ports', value: (product) => product.features.sataPorts },
      hidden,
    ),
    wordsColumn(
      {
        id: 'audio',
        header: 'Audio',
        text: (product) => product.features.audio ?? '—',
        sortBy: (product) => product.features.audio,
        wraps: true,
      },
      hidden,
    ),
    wordsColumn(
      {
        id: 'ioShield',
        header: 'I/O shield',
        label: 'Pre-fitted I/O shield',
        text: (product) => formatYesNo(product.features.ioShieldPrefitted),
        wraps: true,
      },
      hidden,
    ),
    {
      id: 'updated',
      header: 'Updated',
      label: 'Last changed',
      defaultVisible: false,
      numeric: true,
      sortValue: (product) => Date.parse(product.updatedAt),
      cell: (product) => <DateTime value={product.updatedAt} />,
    },
  ];

  if (options.canEdit) {
    columns.push({
      id: 'actions',
      header: 'Actions',
      label: 'Actions',
      defaultVisible: true,
      pinEnd: true,
      cell: (product) => (
        <Link
          to={paths.catalogProductEdit(product.id)}
          className={buttonStyles('secondary', 'sm')}
          aria-label={`Edit ${productDisplayName(product)}`}
        >
          Edit
        </Link>
      ),
    });
  }
  return columns;
}
