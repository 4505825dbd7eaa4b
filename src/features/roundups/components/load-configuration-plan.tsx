import { useId, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Select } from '../../../components/ui/select';
import { cx } from '../../../lib/class-names';
import { loadSettingsModeLabels, type LoadConfiguration } from '../../../../shared/schemas/load-configurations';
import { withUnit } from './planning-format';

export interface LoadConfigurationPlanProps {
  /** Every configuration that may be chosen (saved, not archived), plus any already chosen. */
  configurations: readonly LoadConfiguration[];
  /** The chosen ids in test order. */
  value: readonly number[];
  onChange: (ids: number[]) => void;
  onCreateNew: () => void;
  /** The bench profile's required soak, to flag configurations that soak shorter. */
  requiredSoakMinutes?: number;
  error?: string;
  disabled?: boolean;
}

export function describeConfiguration(configuration: LoadConfiguration): string {
  const settings =
    configuration.settingsMode === 'fixed' && configuration.fixedClockMhz
      ? `fixed ${configuration.fixedClockMhz}\u2009MHz`
      : loadSettingsModeLabels[configuration.settingsMode].toLowerCase();
  return [
    configuration.cpuDescription,
    settings,
    withUnit(configuration.expectedPackagePowerW, 'W', 1),
    withUnit(configuration.coreVoltageV, 'V', 3),
    `soak ${configuration.soakMinutes}\u2009min`,
  ].join(' · ');
}

/**
 * The ordered list of load configurations: each one becomes a matrix column in this order. Moves use buttons
 * (no dragging), so the order can be set from the keyboard and with a screen reader.
 */
/** Moving a configuration one place up or down the matrix; the button at the list's end is shown as unavailable. */
const moves = [
  { step: -1, word: 'Up', arrow: '↑' },
  { step: 1, word: 'Down', arrow: '↓' },
] as const;

export function LoadConfigurationPlan({
  configurations,
  value,
  onChange,
  onCreateNew,
  requiredSoakMinutes,
  error,
  disabled = false,
}: LoadConfigurationPlanProps) {
  const headingId = useId();
  const errorId = useId();
  const [pick, setPick] = useState('');
  const [announcement, setAnnouncement] = useState('');
  const byId = new Map(configurations.map((c) => [c.id, c]));
  const chosen = value.map((id) => byId.get(id)).filter((c): c is LoadConfiguration => c !== undefined);
  const available = configurations.filter((c) => !value.includes(c.id) && !c.archived);

  const move = (index: number, offset: -1 | 1) => {
    const target = index + offset;
    if (target < 0 || target >= value.length) return;
    const next = [...value];
    [next[index], next[target]] = [next[target], next[index]];
    onChange(next);
    setAnnouncement(`${chosen[index].name} is now number ${target + 1} of ${next.length}.`);
  };

  const remove = (index: number) => {
    const name = chosen[index].name;
    onChange(value.filter((_, i) => i !== index));
    setAnnouncement(`${name} removed from the plan.`);
  };

  const add = () => {
    const id = Number(pick);
    if (!id) return;
    onChange([...value, id]);
    setAnnouncement(`${byId.get(id)?.name ?? 'Configuration'} added as number ${value.length + 1}.`);
    setPick('');
  };

  return (
    <div role="group" aria-labelledby={headingId} aria-describedby={error ? errorId : undefined}>
      <h3 id={headingId} className="text-sm font-semibold text-ink">
        Load configurations, in test order
      </h3>
      <p className="mt-0.5 text-[0.8125rem] text-muted">Each configuration is one column of the test matrix.</p>
      {error && (
        <p id={errorId} className="mt-1 flex gap-1.5 text-sm font-medium text-red">
          <span aria-hidden="true">✕</span>
          <span>{error}</span>
        </p>
      )}

      {chosen.length === 0 ? (
        <p className="mt-3 rounded-[3px] border border-dashed border-edge px-3 py-3 text-sm text-muted">
          No configurations in the plan yet.
        </p>
      ) : (
        <ol className="mt-3 divide-y divide-rule rounded-[3px] border border-rule">
          {chosen.map((configuration, index) => {
            const shortSoak = requiredSoakMinutes !== undefined && configuration.soakMinutes < requiredSoakMinutes;
            return (
              <li key={configuration.id} className="flex flex-wrap items-center gap-x-3 gap-y-2 px-3 py-2">
                <span className="numeric w-5 shrink-0 text-right text-muted" aria-hidden="true">
                  {index + 1}
                </span>
                <div className="min-w-0 flex-1 basis-56">
                  <p className="font-medium">
                    <span className="sr-only">Number {index + 1}: </span>
                    {configuration.name}
                  </p>
                  <p className="text-[0.8125rem] text-muted">{describeConfiguration(configuration)}</p>
                  {shortSoak && (
                    <p className="text-[0.8125rem] font-medium text-amber">
                      ! Soaks shorter than the profile’s {requiredSoakMinutes}&thinsp;min.
                    </p>
                  )}
                </div>
                {!disabled && (
                  <div className="flex gap-1.5">
                    {moves.map(({ step, word, arrow }) => {
                      const atEdge = index + step < 0 || index + step >= chosen.length;
                      return (
                        <Button
                          key={word}
                          size="sm"
                          aria-label={`Move ${configuration.name} ${word.toLowerCase()}`}
                          aria-disabled={atEdge || undefined}
                          className={cx(atEdge && 'opacity-55')}
                          onClick={() => move(index, step)}
                        >
                          <span aria-hidden="true">{arrow}</span> {word}
                        </Button>
                      );
                    })}
                    <Button
                      size="sm"
                      variant="quiet"
                      aria-label={`Remove ${configuration.name}`}
                      onClick={() => remove(index)}
                    >
                      Remove
                    </Button>
                  </div>
                )}
              </li>
            );
          })}
        </ol>
      )}

      {!disabled && (
        <div className="mt-3 flex flex-wrap items-end gap-2">
          <Select
            label="Saved configuration"
            options={available.map((c) => ({ value: String(c.id), label: `${c.name} — ${c.cpuDescription}` }))}
            placeholder={available.length ? 'Choose a saved configuration…' : 'No other saved configurations'}
            optional
            value={pick}
            onChange={(event) => setPick(event.target.value)}
            className="min-w-0 flex-1 sm:min-w-72"
          />
          <Button onClick={add} disabled={!pick}>
            Add to plan
          </Button>
          <Button onClick={onCreateNew}>New configuration…</Button>
        </div>
      )}
      <p role="status" className="sr-only">
        {announcement}
      </p>
    </div>
  );
}
