import { useId, useState } from 'react';
import { useDisclosureEscape } from '../../../lib/use-disclosure-escape';
import { buttonStyles } from '../../../components/ui/button';
import { Select } from '../../../components/ui/select';
import { catalogExportUrl } from '../api/import-catalog';

export interface ExportMenuProps {
  regions: readonly string[];
  archived?: string;
  platform?: string;
}

/** Download the catalog as CSV in the import format; the price columns carry the latest price of one region. */
export function ExportMenu({ regions, archived, platform }: ExportMenuProps) {
  const escape = useDisclosureEscape();
  const [region, setRegion] = useState('');
  const hintId = useId();
  const href = catalogExportUrl({
    archived: archived === 'exclude' ? undefined : archived,
    platform,
    priceRegion: region,
  });

  return (
    <details {...escape} className="group relative">
      <summary
        className={buttonStyles('secondary', 'md', 'cursor-pointer list-none [&::-webkit-details-marker]:hidden')}
      >
        Export CSV
        <span aria-hidden="true" className="font-mono text-[0.625rem] group-open:rotate-180">
          ▼
        </span>
      </summary>
      <div className="absolute left-0 z-20 sm:right-0 sm:left-auto mt-1 w-[min(19rem,calc(100vw-2rem))] space-y-3 rounded-[3px] border border-edge bg-surface p-3 shadow-[0_12px_30px_-12px_rgb(16_22_31/0.45)]">
        <Select
          label="Prices from region"
          required={false}
          placeholder="No prices"
          options={regions.map((code) => ({ value: code, label: code }))}
          value={region}
          onChange={(event) => setRegion(event.target.value)}
          description="Each row carries that region’s latest price."
        />
        <p id={hintId} className="text-[0.8125rem] text-muted">
          {platform ? `Products of ${platform}` : 'All products'}
          {archived === 'include' ? ', archived ones included' : ''}. The file imports back unchanged.
        </p>
        <a href={href} download aria-describedby={hintId} className={buttonStyles('primary', 'sm', 'w-full')}>
          Download CSV
        </a>
      </div>
    </details>
  );
}
