import type { ReactNode } from 'react';
import { Panel } from '../../../components/ui/panel';
import { phaseMultiplicationLabels } from '../../../../shared/domain/planning/power-design';
import type { ProductDetail } from '../../../../shared/schemas/catalog';
import { formatCalendarDate } from '../../../lib/format-time';
import {
  formatAmps,
  formatFormFactor,
  formatFrontUsbC,
  formatLanSpeed,
  formatPhases,
  formatRearUsb,
  formatWifi,
  stageTypeLong,
} from './catalog-format';

function Row({ term, children, numeric }: { term: string; children: ReactNode; numeric?: boolean }) {
  const empty = children === null || children === undefined || children === '' || children === '—';
  return (
    <div className="grid grid-cols-[minmax(8rem,40%)_1fr] gap-3 border-b border-rule py-1.5 last:border-b-0">
      <dt className="text-sm text-muted">{term}</dt>
      <dd className={numeric && !empty ? 'numeric text-ink' : 'text-sm text-ink'}>
        {empty ? <span className="text-muted">Not known</span> : children}
      </dd>
    </div>
  );
}

/** One line of the spec: its term, what it shows (null when not known) and whether it is a figure. */
interface SpecLine {
  term: string;
  value: (product: ProductDetail) => ReactNode;
  numeric?: boolean;
}

const productLines: SpecLine[] = [
  { term: 'Maker', value: (product) => product.maker },
  { term: 'Model', value: (product) => product.model },
  { term: 'Platform', value: (product) => product.platform },
  { term: 'Socket', value: (product) => product.socket },
  { term: 'Chipset', value: (product) => product.chipset },
  { term: 'Form factor', value: (product) => formatFormFactor(product.formFactor) },
  {
    term: 'Release date',
    numeric: true,
    value: (product) => (product.releaseDate ? formatCalendarDate(product.releaseDate) : null),
  },
];

const powerDesignLines: SpecLine[] = [
  { term: 'Controller', value: ({ powerDesign: pd }) => pd.controller },
  {
    term: 'Phases',
    numeric: true,
    value: ({ powerDesign: pd }) => (pd.controllerPhases !== null ? formatPhases(pd) : null),
  },
  {
    term: 'Multiplication',
    value: ({ powerDesign: pd }) => (pd.phaseMultiplication ? phaseMultiplicationLabels[pd.phaseMultiplication] : null),
  },
  { term: 'Stages per phase', numeric: true, value: ({ powerDesign: pd }) => pd.stagesPerPhase },
  { term: 'V-core stages', numeric: true, value: ({ powerDesign: pd }) => pd.vcoreStageCount },
  { term: 'Stage type', value: ({ powerDesign: pd }) => (pd.vcoreStageType ? stageTypeLong(pd) : null) },
  { term: 'Stage part', value: ({ powerDesign: pd }) => pd.vcoreStagePart },
  {
    term: 'Rating per stage',
    numeric: true,
    value: ({ powerDesign: pd }) =>
      pd.vcoreStageCurrentA !== null ? `${formatAmps(pd.vcoreStageCurrentA, 0)} continuous` : null,
  },
  {
    term: 'Sum of ratings',
    numeric: true,
    value: ({ powerDesign: pd }) => (pd.vcoreRatedCurrentA !== null ? formatAmps(pd.vcoreRatedCurrentA) : null),
  },
  { term: 'SoC rail stages', numeric: true, value: ({ powerDesign: pd }) => pd.socRailStages },
  { term: 'Other rails', value: ({ powerDesign: pd }) => pd.otherRails },
  { term: 'Heatsink', value: ({ powerDesign: pd }) => pd.heatsinkNotes },
];

const featureLines: SpecLine[] = [
  { term: 'Rear USB', value: ({ features: f }) => formatRearUsb(f.rearUsb) },
  {
    term: 'Front USB-C header',
    value: ({ features: f }) => (f.frontUsbCHeader ? formatFrontUsbC(f.frontUsbCHeader) : null),
  },
  { term: 'Wired LAN', value: ({ features: f }) => (f.lanSpeedMbps !== null ? formatLanSpeed(f.lanSpeedMbps) : null) },
  { term: 'Wi-Fi', value: ({ features: f }) => (f.wifi ? formatWifi(f.wifi) : null) },
  { term: 'M.2 slots', numeric: true, value: ({ features: f }) => f.m2Slots },
  { term: 'SATA ports', numeric: true, value: ({ features: f }) => f.sataPorts },
  { term: 'Audio', value: ({ features: f }) => f.audio },
  {
    term: 'I/O shield',
    value: ({ features: f }) =>
      f.ioShieldPrefitted === null ? null : f.ioShieldPrefitted ? 'Pre-fitted' : 'Separate plate',
  },
];

function SpecLines({ product, lines }: { product: ProductDetail; lines: SpecLine[] }) {
  return (
    <dl>
      {lines.map(({ term, value, numeric }) => (
        <Row key={term} term={term} numeric={numeric}>
          {value(product)}
        </Row>
      ))}
    </dl>
  );
}

/** The product's recorded facts, in three groups: identity, V-core power design, features. */
export function ProductSpec({ product }: { product: ProductDetail }) {
  return (
    <div className="grid grid-cols-1 gap-5 lg:grid-cols-3">
      <Panel title="Product">
        <SpecLines product={product} lines={productLines} />
      </Panel>
      <Panel title="V-core power design">
        <SpecLines product={product} lines={powerDesignLines} />
        <p className="mt-2 text-[0.8125rem] text-muted">
          The sum of ratings adds up the parts’ data-sheet figures; it says nothing about how well the board cools them.
          That is what the bench measures.
        </p>
      </Panel>
      <Panel title="Features">
        <SpecLines product={product} lines={featureLines} />
      </Panel>
    </div>
  );
}
