import type { ReactNode } from 'react';
import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import { temperatureUnits, type TemperatureUnit } from '../../../../shared/schemas/analysis';
import { FieldsetError, GuessedMark } from './column-role-fields';
import { unitLabel } from './format-figures';
import { unitOf } from './mapping-draft';
import { fieldLabels, type MappingForm } from './use-mapping-form';

const unitOptions = temperatureUnits.map((unit) => ({ value: unit, label: unitLabel(unit) }));

const coldJunctionModes = [
  ['none', 'None: no millivolt channels'],
  ['fixed', 'A fixed temperature'],
  ['column', 'A logged column'],
] as const;

export function Unit({ children }: { children: ReactNode }) {
  return <span className="numeric w-10 self-center text-muted">{children}</span>;
}

/** The unit of each temperature column, and the cold junction when any of them is raw type K millivolts. */
export function TemperatureUnitFields({ form }: { form: MappingForm }) {
  const { draft, errors, id, disabled, update, preview, temperatures } = form;

  return (
    <>
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

      {(form.usesMillivolts || draft.coldJunction !== 'none') && (
        <fieldset className="mt-5" aria-describedby={errors.coldJunction ? `${id('coldJunction')}-error` : undefined}>
          <legend className="text-sm font-semibold text-ink">{fieldLabels.coldJunction}</legend>
          <p className="mt-0.5 text-[0.8125rem] text-muted">
            A thermocouple reads the difference to its cold junction, usually the logger’s terminals.
          </p>
          <FieldsetError id={`${id('coldJunction')}-error`} message={errors.coldJunction} />
          <div className="mt-2 space-y-2">
            {coldJunctionModes.map(([mode, label], index) => {
              const inputId = index === 0 ? id('coldJunction') : id(`coldJunction-${mode}`);
              return (
                <div key={mode} className="flex items-center gap-2.5">
                  <input
                    type="radio"
                    id={inputId}
                    name={id('coldJunction')}
                    value={mode}
                    checked={draft.coldJunction === mode}
                    disabled={disabled}
                    onChange={() => update({ coldJunction: mode }, ['coldJunction'])}
                    className="size-4 accent-copper"
                  />
                  <label htmlFor={inputId} className="text-sm text-ink">
                    {label}
                  </label>
                </div>
              );
            })}
          </div>
          <div className="mt-3 grid gap-4 sm:grid-cols-2">
            {draft.coldJunction === 'fixed' && (
              <TextField
                id={id('coldJunctionFixedC')}
                label={fieldLabels.coldJunctionFixedC}
                value={draft.coldJunctionFixedC}
                error={errors.coldJunctionFixedC}
                onChange={(event) => update({ coldJunctionFixedC: event.target.value }, ['coldJunctionFixedC'])}
                inputMode="decimal"
                autoComplete="off"
                disabled={disabled}
                inputClassName="text-right font-mono"
                addon={<Unit>°C</Unit>}
                description="Between −50 and 150 °C."
              />
            )}
            {draft.coldJunction === 'column' && (
              <Select
                id={id('coldJunctionColumn')}
                label={fieldLabels.coldJunctionColumn}
                options={form.columnOptions.filter((option) => option.value !== draft.time)}
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
    </>
  );
}
