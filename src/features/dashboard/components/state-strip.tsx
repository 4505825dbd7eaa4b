import { Link } from 'react-router';
import { paths } from '../../../lib/paths';
import { countOf } from '../../../lib/plural';
import { roundupStateLabels } from '../../../../shared/domain/planning/roundup-states';
import type { Dashboard } from '../../../../shared/schemas/dashboard';

type RoundupsByState = Extract<Dashboard, { view: 'editor' }>['roundupsByState'];

/** How many roundups sit in each state, in Benchwire's order from Planning to Updated; each opens the list filtered. */
export function StateStrip({ roundupsByState }: { roundupsByState: RoundupsByState }) {
  return (
    <ol aria-label="Roundups by state" className="grid grid-cols-2 gap-2 sm:grid-cols-4 lg:grid-cols-7">
      {roundupsByState.map(({ state, roundups }) => (
        <li key={state}>
          <Link
            to={`${paths.roundups}?state=${state}`}
            aria-label={`${roundupStateLabels[state]}: ${countOf(roundups.length, 'roundup', 'roundups')}`}
            className="block rounded-[3px] border border-rule bg-surface px-3 py-2 hover:border-copper data-[empty=true]:bg-transparent"
            data-empty={roundups.length === 0}
          >
            <span className="block text-xs font-semibold tracking-wide text-muted uppercase">
              {roundupStateLabels[state]}
            </span>
            <span className={`numeric block text-xl! leading-tight ${roundups.length ? 'text-ink' : 'text-muted'}`}>
              {roundups.length}
            </span>
          </Link>
        </li>
      ))}
    </ol>
  );
}
