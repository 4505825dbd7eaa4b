import { useMemo, type ReactNode } from 'react';
import { Link, useSearchParams } from 'react-router';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { DataTable, type DataTableColumn } from '../../../components/ui/data-table';
import { dateColumn, textColumn } from '../../../components/ui/data-table-columns';
import { EmptyState } from '../../../components/ui/empty-state';
import { Select } from '../../../components/ui/select';
import {
  roundupStateLabels,
  roundupStates,
  type RoundupState,
} from '../../../../shared/domain/planning/roundup-states';
import type { RoundupSummary } from '../../../../shared/schemas/roundups';
import { formatBandRange } from './planning-format';
import { ProgressMeter } from '../../../components/ui/progress-meter';
import { RoundupStateBadge } from '../../../components/ui/roundup-state-badge';

export interface RoundupsTableProps {
  roundups: readonly RoundupSummary[];
  /** Builds the link to one roundup. */
  roundupPath: (id: number) => string;
  /** Shown when there are no roundups at all, e.g. a "New roundup" button for editors. */
  emptyAction?: ReactNode;
}

function isRoundupState(value: string): value is RoundupState {
  return (roundupStates as readonly string[]).includes(value);
}

const stateOptions = [
  { value: '', label: 'All states' },
  ...roundupStates.map((state) => ({ value: state, label: roundupStateLabels[state] })),
];

export function RoundupsTable({ roundups, roundupPath, emptyAction }: RoundupsTableProps) {
  // The state filter lives in the address (?state=writing), so the dashboard's tiles can open a filtered list.
  const [params, setParams] = useSearchParams();
  const requested = params.get('state');
  const state: RoundupState | '' = requested && isRoundupState(requested) ? requested : '';
  const setState = (next: RoundupState | '') =>
    setParams(
      (current) => {
        const updated = new URLSearchParams(current);
        if (next) updated.set('state', next);
        else updated.delete('state');
        return updated;
      },
      { replace: true },
    );
  const rows = useMemo(() => roundups.filter((r) => !state || r.state === state), [roundups, state]);

  const columns = useMemo<DataTableColumn<RoundupSummary>[]>(
    () => [
      textColumn('title', 'Roundup', (r) => r.title, {
        rowHeader: true,
        className: 'min-w-48',
        filterValue: (r) => `${r.title} ${r.platform} ${roundupStateLabels[r.state]}`,
        cell: (r) => (
          <Link to={roundupPath(r.id)} className="font-semibold text-copper underline-offset-2 hover:underline">
            {r.title}
          </Link>
        ),
      }),
      {
        id: 'state',
        header: 'State',
        sortValue: (r) => roundupStates.indexOf(r.state),
        cell: (r) => <RoundupStateBadge state={r.state} />,
      },
      textColumn('platform', 'Platform', (r) => r.platform, { hideBelow: 'md' }),
      {
        id: 'band',
        header: 'Price band',
        hideBelow: 'lg',
        sortValue: (r) => r.priceBand.minMinor,
        // The range on one line, the region under it: keeps the list inside a laptop screen.
        cell: (r) => (
          <span className="numeric block whitespace-nowrap">
            {formatBandRange(r.priceBand)}
            <span className="block text-xs text-muted">in {r.priceBand.region}</span>
          </span>
        ),
      },
      dateColumn('target', 'Target publish', (r) => r.targetPublishDate, { empty: 'Not set' }),
      {
        id: 'products',
        header: 'Products',
        numeric: true,
        hideBelow: 'sm',
        sortValue: (r) => r.testedEntryCount,
        cell: (r) => (
          <span title={`${r.testedEntryCount} tested, ${r.referenceEntryCount} reference`}>
            {r.testedEntryCount}
            {r.referenceEntryCount > 0 && <span className="text-muted"> +{r.referenceEntryCount} ref.</span>}
          </span>
        ),
      },
      {
        id: 'progress',
        header: 'Accepted',
        sortValue: (r) => r.progress.percentAccepted,
        cell: (r) => <ProgressMeter progress={r.progress} />,
      },
      {
        id: 'loans',
        header: 'Loans',
        label: 'Sample loans',
        hideBelow: 'md',
        sortValue: (r) => r.overdueSampleCount,
        cell: (r) =>
          r.overdueSampleCount > 0 ? (
            <Badge tone="negative">{r.overdueSampleCount} overdue</Badge>
          ) : (
            <span className="text-muted">On time</span>
          ),
      },
    ],
    [roundupPath],
  );

  return (
    <DataTable
      caption="Roundups"
      rows={rows}
      columns={columns}
      initialSort="target"
      filter="Title, platform or state"
      noun={['roundup', 'roundups']}
      columnChoice={{ storageKey: 'benchwire:roundups:columns' }}
      toolbar={
        <Select
          label="State"
          options={stateOptions}
          value={state}
          onChange={(event) => setState(event.target.value as RoundupState | '')}
          className="w-full sm:w-48"
        />
      }
      empty={
        roundups.length === 0 ? (
          <EmptyState title="No roundups yet" action={emptyAction}>
            A roundup gathers boards of one platform in one price band, tests them on one bench profile and publishes
            the results.
          </EmptyState>
        ) : (
          <EmptyState
            title={`No roundup is ${state ? roundupStateLabels[state] : ''} right now`}
            action={<Button onClick={() => setState('')}>Show all states</Button>}
          />
        )
      }
      footnote="Accepted: matrix cells (product × load configuration) an editor has accepted, as a share of all cells."
    />
  );
}
