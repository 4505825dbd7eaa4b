import { useEffect, useRef, useState } from 'react';
import type { ColumnMapping } from '../../../../shared/schemas/analysis';
import { draftFromStoredRequest } from './mapping-draft';
import type { LogCheck } from './use-log-check';

/**
 * Applies a mapping used before (a bench profile's remembered one, a stored run's analysis) to each file the log check
 * reads, once per reading, when the file has every column it names. True while the shown draft came from it.
 */
export function useAppliedMapping(check: LogCheck, mapping: ColumnMapping | null, options?: unknown): boolean {
  const { reading, draft, setDraft } = check;
  const [applied, setApplied] = useState(false);
  const appliedTo = useRef<unknown>(null);
  useEffect(() => {
    if (!reading || !draft || appliedTo.current === reading) return;
    appliedTo.current = reading;
    const names = reading.preview.columns.map((column) => column.name);
    const next = mapping ? draftFromStoredRequest(draft, names, mapping, options) : null;
    setApplied(next !== null);
    if (next) setDraft(next);
  }, [reading, draft, mapping, options, setDraft]);
  return applied;
}
