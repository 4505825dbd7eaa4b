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

/** The product's recorded facts, in three groups: identity, V-core power design, features. */
export function ProductSpec({ product }: { product: ProductDetail }) {
  const pd = product.powerDesign;
  const f = product.features;
  return (
    <div className="grid grid-cols-1 gap-5 lg:grid-cols-3">
      <Panel title="Product">
        <dl>
          <Row term="Maker">{product.maker}</Row>
          <Row term="Model">{product.model}</Row>
          <Row term="Platform">{product.platform}</Row>
          <Row term="Socket">{product.socket}</Row>
          <Row term="Chipset">{product.chipset}</Row>
          <Row term="Form factor">{formatFormFactor(product.formFactor)}</Row>
          <Row term="Release date" numeric>
            {product.releaseDate ? formatCalendarDate(product.releaseDate) : null}
          </Row>
        </dl>
      </Panel>
      <Panel title="V-core power design">
        <dl>
          <Row term="Controller">{pd.controller}</Row>
          <Row term="Phases" numeric>
            {pd.controllerPhases !== null ? formatPhases(pd) : null}
          </Row>
          <Row term="Multiplication">
            {pd.phaseMultiplication ? phaseMultiplicationLabels[pd.phaseMultiplication] : null}
          </Row>
          <Row term="Stages per phase" numeric>
            {pd.stagesPerPhase}
          </Row>
          <Row term="V-core stages" numeric>
            {pd.vcoreStageCount}
          </Row>
          <Row term="Stage type">{pd.vcoreStageType ? stageTypeLong(pd) : null}</Row>
          <Row term="Stage part">{pd.vcoreStagePart}</Row>
          <Row term="Rating per stage" numeric>
            {pd.vcoreStageCurrentA !== null ? `${formatAmps(pd.vcoreStageCurrentA, 0)} continuous` : null}
          </Row>
          <Row term="Sum of ratings" numeric>
            {pd.vcoreRatedCurrentA !== null ? formatAmps(pd.vcoreRatedCurrentA) : null}
          </Row>
          <Row term="SoC rail stages" numeric>
            {pd.socRailStages}
          </Row>
          <Row term="Other rails">{pd.otherRails}</Row>
          <Row term="Heatsink">{pd.heatsinkNotes}</Row>
        </dl>
        <p className="mt-2 text-[0.8125rem] text-muted">
          The sum of ratings adds up the parts’ data-sheet figures; it says nothing about how well the board cools them.
          That is what the bench measures.
        </p>
      </Panel>
      <Panel title="Features">
        <dl>
          <Row term="Rear USB">{formatRearUsb(f.rearUsb)}</Row>
          <Row term="Front USB-C header">{f.frontUsbCHeader ? formatFrontUsbC(f.frontUsbCHeader) : null}</Row>
          <Row term="Wired LAN">{f.lanSpeedMbps !== null ? formatLanSpeed(f.lanSpeedMbps) : null}</Row>
          <Row term="Wi-Fi">{f.wifi ? formatWifi(f.wifi) : null}</Row>
          <Row term="M.2 slots" numeric>
            {f.m2Slots}
          </Row>
          <Row term="SATA ports" numeric>
            {f.sataPorts}
          </Row>
          <Row term="Audio">{f.audio}</Row>
          <Row term="I/O shield">
            {f.ioShieldPrefitted === null ? null : f.ioShieldPrefitted ? 'Pre-fitted' : 'Separate plate'}
          </Row>
        </dl>
      </Panel>
    </div>
  );
}
