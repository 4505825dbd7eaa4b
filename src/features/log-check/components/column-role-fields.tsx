import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Checkbox } from '../../../components/ui/checkbox';
import { Select } from '../../../components/ui/select';
import { guessedRoleOf, roleLabels } from './mapping-draft';
import { fieldLabels, type MappingForm } from './use-mapping-form';

export function GuessedMark({ shown }: { shown: boolean }) {
  if (!shown) return null;
  return (
    <Badge tone="caution" className="ml-2 align-middle">
      guessed — check it
    </Badge>
  );
}

/** The error of a group of fields (a fieldset), tied to it by aria-describedby on the fieldset. */
export function FieldsetError({ id, message }: { id: string; message: string | undefined }) {
  if (!message) return null;
  return (
    <p id={id} className="mt-1 flex gap-1.5 text-sm font-medium text-red">
      <span aria-hidden="true">✕</span>
      <span>{message}</span>
    </p>
  );
}

const roleDescriptions = {
  ambient: 'Needed for delta over ambient and the normalised peak.',
  clock: 'Throttling is detected from the clock (MHz, or GHz when the header says so).',
  power: 'Used for throttling when no clock is logged, and to find the load start.',
} as const;

/** Which column is time, which are VRM probes, and the optional ambient, clock and power columns. */
export function ColumnRoleFields({ form, guessed }: { form: MappingForm; guessed: boolean }) {
  const { draft, errors, id, disabled, update, preview, names } = form;

  return (
    <>
      {guessed ? (
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
              <GuessedMark shown={form.isGuessed('time')} />
            </>
          }
          options={form.columnOptions}
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
                <GuessedMark shown={form.isGuessed(role)} />
              </>
            }
            optional
            options={form.optionsFor(role)}
            placeholder={role === 'ambient' ? 'No ambient probe logged' : 'Not logged'}
            value={draft[role]}
            error={errors[role]}
            disabled={disabled}
            description={roleDescriptions[role]}
            onChange={(event) => update({ [role]: event.target.value }, [role])}
          />
        ))}
      </div>

      <fieldset className="mt-5" aria-describedby={errors.vrm ? `${id('vrm')}-error` : undefined}>
        <legend className="text-sm font-semibold text-ink">
          {fieldLabels.vrm}
          <GuessedMark shown={form.vrmGuessed} />
        </legend>
        <p className="mt-0.5 text-[0.8125rem] text-muted">
          Every thermocouple on the power stages or their heatsink. The peak is the hottest of them.
        </p>
        <FieldsetError id={`${id('vrm')}-error`} message={errors.vrm} />
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
    </>
  );
}
