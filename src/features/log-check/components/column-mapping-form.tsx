import { useId, useState, type FormEvent, type ReactNode } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Checkbox } from '../../../components/ui/checkbox';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { Panel } from '../../../components/ui/panel';
import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import type { FormErrorItem } from '../../../lib/form-errors';
import { thermocoupleToleranceClasses } from '../../../../shared/domain/analysis/thermocouple-tolerance';
import {
  temperatureUnits,
  toleranceClasses,
  type AnalysisRequestInput,
  type LogPreview,
  type TemperatureUnit,
  type ToleranceClass,
} from '../../../../shared/schemas/analysis';
import { unitLabel } from './format-figures';
import {
  defaultOptions,
  guessedRoleOf,
  requestFromDraft,
  roleLabels,
  temperatureColumns,
  unitOf,
  type DraftErrors,
  type DraftField,
  type MappingDraft,
} from './mapping-draft';

export interface ColumnMappingFormProps {
  preview: LogPreview;
  draft: MappingDraft;
  /** The draft as the server guessed it, to mark fields the tester has not yet changed. */
  guess: MappingDraft | null;
  onChange: (draft: MappingDraft) => void;
  onAnalyse: (request: AnalysisRequestInput) => void;
  pending: boolean;
  disabled?: boolean;
}

const fieldLabels: Record<Exclude<DraftField, `unit:${string}`>, string> = {
  time: 'Time column',
  vrm: 'VRM probe columns',
  ambient: 'Ambient column',
  clock: 'Clock column',
  power: 'Package power column',
  coldJunction: 'Cold junction',
  coldJunctionFixedC: 'Cold-junction temperature',
  coldJunctionColumn: 'Cold-junction column',
  soakMinutes: 'Required soak',
  ambientTargetC: 'Room target',
  ambientToleranceC: 'Room tolerance (±)',
  ambientDriftLimitC: 'Largest room drift',
  toleranceClass: 'Thermocouple tolerance class',
  useNormalizedPeak: 'Judge the normalised peak',
  manualThrottleMinute: 'Throttled at minute',
  throttlePercent: 'Throttle threshold',
  throttleMinSeconds: 'Throttle lasts at least',
  comfortableBelowC: 'Comfortable below',
  warmUpToC: 'Warm up to',
  testerMarkedUnstable: 'The system was unstable',
};

const unitOptions = temperatureUnits.map((unit) => ({ value: unit, label: unitLabel(unit) }));
const toleranceOptions = toleranceClasses.map((value) => ({
  value,
  label: thermocoupleToleranceClasses[value].standard,
}));

function GuessedMark({ shown }: { shown: boolean }) {
  if (!shown) return null;
  return (
    <Badge tone="caution" className="ml-2 align-middle">
      guessed — check it
    </Badge>
  );
}

function Unit({ children }: { children: ReactNode }) {
  return <span className="numeric w-10 self-center text-muted">{children}</span>;
}

/**
 * The tester's mapping of columns to roles and the analysis options. It opens with the server's guess, marked on every
 * field it filled in, and sends nothing until the tester presses Analyse.
 */
export function ColumnMappingForm({
  preview,
  draft,
  guess,
  onChange,
  onAnalyse,
  pending,
  disabled = false,
}: ColumnMappingFormProps) {
  const formId = useId();
  const [errors, setErrors] = useState<DraftErrors>({});
  const [attempt, setAttempt] = useState(0);
  const id = (field: string) => `${formId}-${field.replace(/[^a-z0-9-]/gi, '_')}`;
  const names = preview.columns.map((column) => column.name);
  const columnOptions = preview.columns.map((column) => ({
    value: column.name,
    label: `${column.index + 1} · ${column.name || '(no name)'}`,
  }));

  const update = (changes: Partial<MappingDraft>, cleared: DraftField[]) => {
    onChange({ ...draft, ...changes });
    if (cleared.some((field) => errors[field])) {
      setErrors((current) => {
        const next = { ...current };
        for (const field of cleared) delete next[field];
        return next;
      });
    }
  };
  const text = (field: keyof MappingDraft & DraftField) => ({
    id: id(field),
    label: fieldLabels[field as keyof typeof fieldLabels],
    value: draft[field] as string,
    error: errors[field],
    onChange: (event: { target: { value: string } }) => update({ [field]: event.target.value }, [field]),
  });
  // Every figure field: decimal keypad on phones, right-aligned tabular digits.
  const figure = {
    inputMode: 'decimal',
    autoComplete: 'off',
    disabled,
    inputClassName: 'text-right font-mono',
  } as const;
  const isGuessed = (field: 'time' | 'ambient' | 'clock' | 'power') =>
    Boolean(guess && guess[field] && draft[field] === guess[field]);
  const vrmGuessed = Boolean(guess && guess.vrm.length > 0 && draft.vrm.join('\u0000') === guess.vrm.join('\u0000'));

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const outcome = requestFromDraft(draft, preview);
    if (outcome.errors) {
      setErrors(outcome.errors);
      setAttempt((count) => count + 1);
      return;
    }
    setErrors({});
    onAnalyse(outcome.request);
  };

  const summaryItems: FormErrorItem[] = (Object.keys(fieldLabels) as (keyof typeof fieldLabels)[])
    .filter((field) => errors[field])
    .map((field) => ({
      fieldId: field === 'vrm' ? id(`vrm-${names.find((name) => name !== draft.time) ?? ''}`) : id(field),
      label: fieldLabels[field],
      message: errors[field] as string,
    }));

  const temperatures = temperatureColumns(draft, preview);
  const usesMillivolts = temperatures.some((column) => unitOf(draft, preview, column) === 'mV');
  // A role offers the columns no other role holds, plus its own choice so an error beside it still makes sense.
  const optionsFor = (role: 'ambient' | 'clock' | 'power') =>
    columnOptions.filter(
      (option) => option.value === draft[role] || (option.value !== draft.time && !draft.vrm.includes(option.value)),
    );

  return (
    <form noValidate onSubmit={submit} aria-label="Column mapping and analysis options" className="space-y-5">
      <FormErrorSummary
        title="Nothing was analysed yet"
        items={summaryItems}
        message={summaryItems.length === 0 && Object.keys(errors).length > 0 ? Object.values(errors)[0] : undefined}
        attempt={attempt}
      />

      <Panel
        title="Column mapping"
        description="Which column is which. The server reads the file again with exactly this mapping."
      >
        {guess ? (
          <Alert tone="warning" title="Guessed from the header names — check it" className="mb-4">
            Benchwire matched columns to roles by their names only. Fields marked{' '}
            <Badge tone="caution">guessed — check it</Badge> still hold the guess: compare each one with the logger’s
            channel list. Nothing is analysed until you press Analyse.
          </Alert>
        ) : (
          <Alert tone="warning" title="No mapping could be guessed" className="mb-4">
            The header names did not say which columns are VRM probes. Choose them below.
          </Alert>
        )}

        <div className="grid gap-4 sm:grid-cols-2">
          <Select
            id={id('time')}
            label={
              <>
                {fieldLabels.time}
                <GuessedMark shown={isGuessed('time')} />
              </>
            }
            options={columnOptions}
            placeholder="Choose the time column…"
            value={draft.time}
            error={errors.time}
            disabled={disabled}
            onChange={(event) => {
              const time = event.target.value;
              update({ time, vrm: draft.vrm.filter((name) => name !== time) }, ['time', 'vrm']);
            }}
          />
          {(['ambient', 'clock', 'power'] as const).map((role) => (
            <Select
              key={role}
              id={id(role)}
              label={
                <>
                  {fieldLabels[role]}
                  <GuessedMark shown={isGuessed(role)} />
                </>
              }
              optional
              options={optionsFor(role)}
              placeholder={role === 'ambient' ? 'No ambient probe logged' : 'Not logged'}
              value={draft[role]}
              error={errors[role]}
              disabled={disabled}
              description={
                role === 'ambient'
                  ? 'Needed for delta over ambient and the normalised peak.'
                  : role === 'clock'
                    ? 'Throttling is detected from the clock (MHz, or GHz when the header says so).'
                    : 'Used for throttling when no clock is logged, and to find the load start.'
              }
              onChange={(event) => update({ [role]: event.target.value }, [role])}
            />
          ))}
        </div>

        <fieldset className="mt-5" aria-describedby={errors.vrm ? `${id('vrm')}-error` : undefined}>
          <legend className="text-sm font-semibold text-ink">
            {fieldLabels.vrm}
            <GuessedMark shown={vrmGuessed} />
          </legend>
          <p className="mt-0.5 text-[0.8125rem] text-muted">
            Every thermocouple on the power stages or their heatsink. The peak is the hottest of them.
          </p>
          {errors.vrm && (
            <p id={`${id('vrm')}-error`} className="mt-1 flex gap-1.5 text-sm font-medium text-red">
              <span aria-hidden="true">✕</span>
              <span>{errors.vrm}</span>
            </p>
          )}
          <div className="mt-2 grid gap-x-4 gap-y-1.5 sm:grid-cols-2 lg:grid-cols-3">
            {preview.columns
              .filter((column) => column.name !== draft.time)
              .map((column) => (
                <Checkbox
                  key={column.index}
                  id={id(`vrm-${column.name}`)}
                  label={<span className="font-mono text-[0.8125rem] font-normal">{column.name || '(no name)'}</span>}
                  description={`Guessed: ${roleLabels[guessedRoleOf(preview, column)]}`}
                  checked={draft.vrm.includes(column.name)}
                  disabled={disabled}
                  onChange={(event) => {
                    const vrm = event.target.checked
                      ? names.filter((name) => name === column.name || draft.vrm.includes(name))
                      : draft.vrm.filter((name) => name !== column.name);
                    update({ vrm }, ['vrm']);
                  }}
                />
              ))}
          </div>
        </fieldset>

        {temperatures.length > 0 && (
          <div className="mt-5">
            <h3 className="text-sm font-semibold text-ink">Units of the temperature columns</h3>
            <p className="mt-0.5 text-[0.8125rem] text-muted">
              Raw type K millivolts (mV) are converted with cold-junction compensation.
            </p>
            <div className="mt-2 grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
              {temperatures.map((column) => {
                const fromHeader = preview.columns.find((entry) => entry.name === column)?.guessedUnit ?? null;
                const chosen = draft.units[column];
                return (
                  <Select
                    key={column}
                    id={id(`unit-${column}`)}
                    label={
                      <>
                        <span className="font-mono text-[0.8125rem]">{column}</span>
                        <GuessedMark shown={!chosen && !fromHeader} />
                      </>
                    }
                    options={unitOptions}
                    value={unitOf(draft, preview, column)}
                    disabled={disabled}
                    description={
                      fromHeader
                        ? `The header says ${unitLabel(fromHeader)}.`
                        : 'The header names no unit; °C unless you choose another.'
                    }
                    onChange={(event) =>
                      update({ units: { ...draft.units, [column]: event.target.value as TemperatureUnit } }, [])
                    }
                  />
                );
              })}
            </div>
          </div>
        )}

        {(usesMillivolts || draft.coldJunction !== 'none') && (
          <fieldset className="mt-5" aria-describedby={errors.coldJunction ? `${id('coldJunction')}-error` : undefined}>
            <legend className="text-sm font-semibold text-ink">{fieldLabels.coldJunction}</legend>
            <p className="mt-0.5 text-[0.8125rem] text-muted">
              A thermocouple reads the difference to its cold junction, usually the logger’s terminals.
            </p>
            {errors.coldJunction && (
              <p id={`${id('coldJunction')}-error`} className="mt-1 flex gap-1.5 text-sm font-medium text-red">
                <span aria-hidden="true">✕</span>
                <span>{errors.coldJunction}</span>
              </p>
            )}
            <div className="mt-2 space-y-2">
              {(
                [
                  ['none', 'None: no millivolt channels'],
                  ['fixed', 'A fixed temperature'],
                  ['column', 'A logged column'],
                ] as const
              ).map(([mode, label], index) => (
                <div key={mode} className="flex items-center gap-2.5">
                  <input
                    type="radio"
                    id={index === 0 ? id('coldJunction') : id(`coldJunction-${mode}`)}
                    name={id('coldJunction')}
                    value={mode}
                    checked={draft.coldJunction === mode}
                    disabled={disabled}
                    onChange={() => update({ coldJunction: mode }, ['coldJunction'])}
                    className="size-4 accent-copper"
                  />
                  <label
                    htmlFor={index === 0 ? id('coldJunction') : id(`coldJunction-${mode}`)}
                    className="text-sm text-ink"
                  >
                    {label}
                  </label>
                </div>
              ))}
            </div>
            <div className="mt-3 grid gap-4 sm:grid-cols-2">
              {draft.coldJunction === 'fixed' && (
                <TextField
                  {...text('coldJunctionFixedC')}
                  {...figure}
                  addon={<Unit>°C</Unit>}
                  description="Between −50 and 150 °C."
                />
              )}
              {draft.coldJunction === 'column' && (
                <Select
                  id={id('coldJunctionColumn')}
                  label={fieldLabels.coldJunctionColumn}
                  options={columnOptions.filter((option) => option.value !== draft.time)}
                  placeholder="Choose the column…"
                  value={draft.coldJunctionColumn}
                  error={errors.coldJunctionColumn}
                  disabled={disabled}
                  description="Read in °C unless its header or unit says otherwise."
                  onChange={(event) => update({ coldJunctionColumn: event.target.value }, ['coldJunctionColumn'])}
                />
              )}
            </div>
          </fieldset>
        )}
      </Panel>

      <Panel
        title="Analysis options"
        description="The schema’s defaults; change them to match the load configuration and the bench."
      >
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
          <TextField
            {...text('soakMinutes')}
            {...figure}
            addon={<Unit>min</Unit>}
            description={`Default ${defaultOptions.soakMinutes} min per load.`}
          />
          <TextField {...text('ambientTargetC')} {...figure} addon={<Unit>°C</Unit>} />
          <TextField {...text('ambientToleranceC')} {...figure} addon={<Unit>°C</Unit>} />
          <TextField
            {...text('ambientDriftLimitC')}
            {...figure}
            addon={<Unit>°C</Unit>}
            description="Over the whole run."
          />
        </div>
        <div className="mt-4 grid gap-4 sm:grid-cols-2">
          <Select
            id={id('toleranceClass')}
            label={fieldLabels.toleranceClass}
            options={toleranceOptions}
            value={draft.toleranceClass}
            error={errors.toleranceClass}
            disabled={disabled}
            description="Sets the ± band printed with the peak."
            onChange={(event) => update({ toleranceClass: event.target.value as ToleranceClass }, ['toleranceClass'])}
          />
          <TextField
            {...text('manualThrottleMinute')}
            optional
            inputMode="decimal"
            autoComplete="off"
            disabled={disabled || Boolean(draft.clock)}
            inputClassName="text-right font-mono"
            addon={<Unit>min</Unit>}
            description={
              draft.clock
                ? 'A clock column is mapped: throttling is detected from it.'
                : 'Only when no clock is logged: the minute you saw the CPU throttle. Leave empty if it did not.'
            }
          />
        </div>
        <div className="mt-4 space-y-3">
          <Checkbox
            id={id('useNormalizedPeak')}
            label={fieldLabels.useNormalizedPeak}
            checked={draft.useNormalizedPeak}
            disabled={disabled}
            description={`The verdict uses ${defaultOptions.referenceRoomC}\u2009°C plus the delta over ambient instead of the absolute peak (needs an ambient column).`}
            onChange={(event) => update({ useNormalizedPeak: event.target.checked }, [])}
          />
          <Checkbox
            id={id('testerMarkedUnstable')}
            label="The system was unstable during the soak (crash or reset)"
            checked={draft.testerMarkedUnstable}
            disabled={disabled}
            description="An unstable run fails, whatever the temperatures."
            onChange={(event) => update({ testerMarkedUnstable: event.target.checked }, [])}
          />
        </div>
        <details
          className="mt-4"
          open={
            Boolean(
              errors.throttlePercent || errors.throttleMinSeconds || errors.comfortableBelowC || errors.warmUpToC,
            ) || undefined
          }
        >
          <summary className="cursor-pointer text-sm font-semibold text-ink">Throttle rule and verdict limits</summary>
          <div className="mt-3 grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
            <TextField
              {...text('throttlePercent')}
              {...figure}
              addon={<Unit>%</Unit>}
              description="Throttled below this share of the loaded median clock."
            />
            <TextField {...text('throttleMinSeconds')} {...figure} addon={<Unit>s</Unit>} />
            <TextField {...text('comfortableBelowC')} {...figure} addon={<Unit>°C</Unit>} />
            <TextField
              {...text('warmUpToC')}
              {...figure}
              addon={<Unit>°C</Unit>}
              description="Above it, a run that held its clock is Hot but held."
            />
          </div>
        </details>
      </Panel>

      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" variant="primary" pending={pending} disabled={disabled}>
          Analyse
        </Button>
        <p className="text-[0.8125rem] text-muted">Sends the same file again with this mapping and these options.</p>
      </div>
    </form>
  );
}
