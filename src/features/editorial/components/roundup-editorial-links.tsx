import { useReadinessSummary } from '../api/readiness';
import { EditorialNav } from './editorial-nav';
import type { RoundupState } from '../../../../shared/domain/planning/roundup-states';

const editorialFrom: readonly RoundupState[] = ['on-the-bench', 'writing', 'in-review', 'scheduled', 'live', 'updated'];

/** On a roundup: the editorial screens, and whether it is ready to schedule (computed, never stored). */
export function RoundupEditorialLinks({ roundupId, state }: { roundupId: number; state: RoundupState }) {
  const shown = editorialFrom.includes(state);
  const readiness = useReadinessSummary(roundupId, shown && (state === 'writing' || state === 'in-review'));
  if (!shown) return null;
  const data = readiness.data;
  const label = !data
    ? undefined
    : data.ready
      ? 'Ready to schedule ✓'
      : `Ready to schedule? ${data.blocking.length} blocking`;
  return <EditorialNav roundupId={roundupId} readyLabel={label} />;
}
