import { Link } from 'react-router';
import { Badge } from '../../../components/ui/badge';
import { buttonStyles } from '../../../components/ui/button';
import type { DataTableColumn } from '../../../components/ui/data-table';
import { DateTime } from '../../../components/ui/date-time';
import { paths } from '../../../lib/paths';
import type { Product } from '../../../../shared/schemas/catalog';
import { formatPrice } from '../../../lib/format-money';
import { formatCalendarDate } from '../../../lib/format-time';
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
    {
      id: 'maker',
      header: 'Maker',
      label: 'Maker',
      defaultVisible: true,
      hideBelow: 'sm',
      sortValue: (product) => product.maker,
      cell: (product) => nowrap(product.maker),
    },
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
    {
      id: 'platform',
      header: 'Platform / socket',
      label: 'Platform and socket',
      defaultVisible: true,
      sortValue: (product) => `${product.platform} ${product.socket}`,
      cell: (product) => nowrap(`${product.platform} · ${product.socket}`),
    },
    {
      id: 'chipset',
      header: 'Chipset',
      label: 'Chipset',
      defaultVisible: true,
      sortValue: (product) => product.chipset,
      cell: (product) => nowrap(product.chipset),
    },
    {
      id: 'formFactor',
      header: 'Form factor',
      label: 'Form factor',
      defaultVisible: true,
      sortValue: (product) => formatFormFactor(product.formFactor),
      cell: (product) => nowrap(formatFormFactor(product.formFactor)),
    },
    {
      id: 'releaseDate',
      header: 'Released',
      label: 'Release date',
      defaultVisible: true,
      numeric: true,
      sortValue: (product) => product.releaseDate,
      cell: (product) => muted(product.releaseDate ? formatCalendarDate(product.releaseDate) : '—'),
    },
    {
      id: 'controller',
      header: 'Controller',
      label: 'V-core controller',
      defaultVisible: true,
      sortValue: (product) => product.powerDesign.controller,
      cell: (product) => nowrap(product.powerDesign.controller ?? '—'),
    },
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
    {
      id: 'stageRating',
      header: 'Stage rating',
      label: 'Continuous rating per stage',
      defaultVisible: true,
      numeric: true,
      sortValue: (product) => product.powerDesign.vcoreStageCurrentA,
      cell: (product) => muted(formatAmps(product.powerDesign.vcoreStageCurrentA, 0)),
    },
    {
      id: 'ratedSum',
      header: 'Rating sum',
      label: 'V-core stages × rating',
      defaultVisible: false,
      numeric: true,
      sortValue: (product) => product.powerDesign.vcoreRatedCurrentA,
      cell: (product) => {
        const { vcoreStageCount, vcoreRatedCurrentA } = product.powerDesign;
        if (vcoreRatedCurrentA === null) return <span className="text-muted">—</span>;
        return `${formatAmps(vcoreRatedCurrentA)} (${vcoreStageCount} stages)`;
      },
    },
    {
      id: 'socRail',
      header: 'SoC stages',
      label: 'SoC rail stages',
      defaultVisible: false,
      numeric: true,
      sortValue: (product) => product.powerDesign.socRailStages,
      cell: (product) => muted(String(product.powerDesign.socRailStages ?? '—')),
    },
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
    {
      id: 'rearUsb',
      header: 'Rear USB',
      label: 'Rear USB by speed',
      defaultVisible: false,
      sortValue: (product) => rearUsbTotal(product.features.rearUsb),
      cell: (product) => nowrap(formatRearUsb(product.features.rearUsb)),
    },
    {
      id: 'frontUsbC',
      header: 'Front USB-C',
      label: 'Front USB-C header',
      defaultVisible: false,
      sortValue: (product) => formatFrontUsbC(product.features.frontUsbCHeader),
      cell: (product) => nowrap(formatFrontUsbC(product.features.frontUsbCHeader)),
    },
    {
      id: 'lan',
      header: 'LAN',
      label: 'Wired LAN speed',
      defaultVisible: false,
      numeric: true,
      sortValue: (product) => product.features.lanSpeedMbps,
      cell: (product) => muted(formatLanSpeed(product.features.lanSpeedMbps)),
    },
    {
      id: 'wifi',
      header: 'Wi-Fi',
      label: 'Wi-Fi',
      defaultVisible: false,
      sortValue: (product) => formatWifi(product.features.wifi),
      cell: (product) => nowrap(formatWifi(product.features.wifi)),
    },
    {
      id: 'm2',
      header: 'M.2',
      label: 'M.2 slots',
      defaultVisible: false,
      numeric: true,
      sortValue: (product) => product.features.m2Slots,
      cell: (product) => muted(String(product.features.m2Slots ?? '—')),
    },
    {
      id: 'sata',
      header: 'SATA',
      label: 'SATA ports',
      defaultVisible: false,
      numeric: true,
      sortValue: (product) => product.features.sataPorts,
      cell: (product) => muted(String(product.features.sataPorts ?? '—')),
    },
    {
      id: 'audio',
      header: 'Audio',
      label: 'Audio',
      defaultVisible: false,
      sortValue: (product) => product.features.audio,
      cell: (product) => muted(product.features.audio ?? '—'),
    },
    {
      id: 'ioShield',
      header: 'I/O shield',
      label: 'Pre-fitted I/O shield',
      defaultVisible: false,
      sortValue: (product) => formatYesNo(product.features.ioShieldPrefitted),
      cell: (product) => muted(formatYesNo(product.features.ioShieldPrefitted)),
    },
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
