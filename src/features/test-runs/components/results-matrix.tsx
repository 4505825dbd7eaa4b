import { useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import type { FieldErrors } from '../../../lib/form-errors';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { DataTable, type DataTableColumn } from '../../../components/ui/data-table';
import { LoadingState } from '../../../components/ui/loading-state';
import { cx } from '../../../lib/class-names';
import { describeSubmitError } from '../../../lib/form-errors';
import { defaultVerdictRubric, type VerdictCode, type VerdictRubric } from '../../../../shared/schemas/analysis';
import type { ResultCell } from '../../../../shared/schemas/test-runs';
import { formatC, formatDeltaC } from '../../log-check/components/format-figures';
import { useRoundupResults, useSetRubric } from '../api/test-runs-api';
import { CelsiusFields, readCelsius, type CelsiusFieldSpec } from './celsius-field';
import { FlagCount } from './run-detail';

type ResultsRow = { entryId: number; name: string };

export interface ResultsMatrixProps {
  roundupId: number;
  rows: ResultsRow[];
  columns: { id: number; name: string }[];
  cellPath: (cellId: number) => string;
  canEditRubric: boolean;
}

// The DESIGN palette per verdict; every cell also says its verdict in words and marks flags, manual values and throttling.
const verdictStyles: Record<VerdictCode, string> = {
  comfortable: 'border-l-teal bg-teal/10',
  warm: 'border-l-amber bg-amber/10',
  'hot-but-held': 'border-l-copper bg-copper/10',
  throttled: 'border-l-red bg-red/10',
};

function ResultCellView({ cell, figure, href }: { cell: ResultCell; figure: 'peak' | 'delta'; href: string }) {
  if (cell.runId === null) {
    return (
      <Link to={href} className="block px-3 py-2 text-muted underline-offset-2 hover:underline">
        No run yet
      </Link>
    );
  }
  const value = figure === 'peak' ? formatC(cell.peakC) : formatDeltaC(cell.deltaOverAmbientC);
  return (
    <Link
      to={href}
      className={cx(
        'block border-l-4 px-3 py-2 hover:underline',
        cell.verdict && cell.verdictStatus !== 'withheld' ? verdictStyles[cell.verdict] : 'border-l-rule',
      )}
    >
      <span className="numeric block font-semibold text-ink">{value}</span>
      <span className="block text-[0.8125rem] text-ink">{cell.verdictLabel ?? 'No verdict yet'}</span>
      <span className="flex flex-wrap gap-x-2 text-[0.8125rem]">
        <FlagCount count={cell.flagCount} />
        {cell.source === 'manual' && <span className="text-copper">✎ Manual</span>}
        {cell.throttled && <span className="text-red">✕ Throttled</span>}
        {!cell.isRunOfRecord && <span className="text-muted">Newest run</span>}
      </span>
    </Link>
  );
}

const rubricFields: readonly CelsiusFieldSpec<'comfortableBelowC' | 'warmUpToC'>[] = [
  {
    name: 'comfortableBelowC',
    id: 'rubric-comfortable',
    label: 'Comfortable below (°C)',
    invalid: 'Enter a temperature in °C.',
  },
  { name: 'warmUpToC', id: 'rubric-warm', label: 'Warm up to (°C)', invalid: 'Enter a temperature in °C.' },
];

const typedLimits = (rubric: VerdictRubric) => ({
  comfortableBelowC: String(rubric.comfortableBelowC),
  warmUpToC: String(rubric.warmUpToC),
});

function RubricForm({
  roundupId,
  rubric,
  isDefault,
}: {
  roundupId: number;
  rubric: VerdictRubric;
  isDefault: boolean;
}) {
  const [limits, setLimits] = useState(typedLimits(rubric));
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const save = useSetRubric();

  const send = (next: VerdictRubric | null) => {
    setMessage(null);
    save.mutate(
      { roundupId, rubric: next },
      {
        onSuccess: () => {
          if (next === null) setLimits(typedLimits(defaultVerdictRubric));
        },
        onError: (error) => {
          const described = describeSubmitError(error);
          setErrors({
            comfortableBelowC: described.fields['rubric.comfortableBelowC'] ?? described.fields.comfortableBelowC,
            warmUpToC: described.fields['rubric.warmUpToC'] ?? described.fields.warmUpToC,
          });
          setMessage(described.message);
        },
      },
    );
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const { values, errors: found } = readCelsius(rubricFields, limits);
    if (!found.warmUpToC && values.comfortableBelowC > values.warmUpToC)
      found.warmUpToC = 'The warm limit must not be below the comfortable limit.';
    setErrors(found);
    if (Object.keys(found).length > 0) return;
    send({ ...rubric, ...values });
  };

  return (
    <form noValidate onSubmit={submit} aria-label="Verdict rubric" className="flex flex-wrap items-end gap-3">
      <CelsiusFields fields={rubricFields} typed={limits} onChange={setLimits} errors={errors} className="w-44" />
      <Button type="submit" pending={save.isPending && save.variables?.rubric !== null}>
        Save the rubric
      </Button>
      {!isDefault && (
        <Button type="button" variant="quiet" onClick={() => send(null)}>
          Reset to defaults
        </Button>
      )}
      {message && (
        <Alert tone="danger" announce className="w-full">
          {message}
        </Alert>
      )}
    </form>
  );
}

/** The results matrix: per cell the run of record's peak or delta over ambient, coloured and named by its verdict. */
export function ResultsMatrix({ roundupId, rows, columns, cellPath, canEditRubric }: ResultsMatrixProps) {
  const results = useRoundupResults(roundupId);
  const [figure, setFigure] = useState<'peak' | 'delta'>('peak');
  if (results.isPending) return <LoadingState label="Loading the results…" />;
  if (results.isError) return <Alert tone="danger">The results could not be loaded. {results.error.message}</Alert>;
  const { cells, rubric, rubricIsDefault } = results.data;
  const byPlace = new Map(cells.map((cell) => [`${cell.entryId}:${cell.loadConfigurationId}`, cell]));

  return (
    <div className="space-y-4">
      <fieldset className="flex flex-wrap items-center gap-2">
        <legend className="sr-only">Figure shown</legend>
        <Button size="sm" aria-pressed={figure === 'peak'} onClick={() => setFigure('peak')}>
          Peak
        </Button>
        <Button size="sm" aria-pressed={figure === 'delta'} onClick={() => setFigure('delta')}>
          Delta over ambient
        </Button>
        <span className="text-sm text-muted">
          Comfortable below {formatC(rubric.comfortableBelowC, 0)}, warm up to {formatC(rubric.warmUpToC, 0)}
          {rubricIsDefault ? ' (defaults)' : ''}.
        </span>
      </fieldset>
      <DataTable
        caption="Results"
        rows={rows}
        columns={[
          { id: 'product', header: 'Product', rowHeader: true, sortValue: (row) => row.name, cell: (row) => row.name },
          ...columns.map((column): DataTableColumn<ResultsRow> => ({
            id: String(column.id),
            header: column.name,
            flush: true,
            cell: (row) => {
              const cell = byPlace.get(`${row.entryId}:${column.id}`);
              return cell ? (
                <ResultCellView cell={cell} figure={figure} href={cellPath(cell.cellId)} />
              ) : (
                <span className="block px-3 py-2 text-muted">Not planned</span>
              );
            },
          })),
        ]}
        rowKey={(row) => row.entryId}
      />
      {canEditRubric && (
        <RubricForm key={JSON.stringify(rubric)} roundupId={roundupId} rubric={rubric} isDefault={rubricIsDefault} />
      )}
    </div>
  );
}
