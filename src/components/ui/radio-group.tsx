import type { ReactNode } from 'react';

/** One choice: its value, what it is called, and for a stacked group a line saying what it means. */
export type RadioChoice<Value extends string> = readonly [value: Value, label: ReactNode, hint?: ReactNode];

export interface RadioGroupProps<Value extends string> {
  legend: ReactNode;
  /** The inputs' shared name, unique on the page. */
  name: string;
  choices: readonly RadioChoice<Value>[];
  value: Value;
  onChange: (value: Value) => void;
  /** Short choices side by side; otherwise one a line, each with its hint. */
  inline?: boolean;
}

/** A set of radio buttons under a legend; arrow keys move between them as the browser does for any radio group. */
export function RadioGroup<Value extends string>({
  legend,
  name,
  choices,
  value,
  onChange,
  inline = false,
}: RadioGroupProps<Value>) {
  return (
    <fieldset>
      <legend className="mb-1.5 text-sm font-semibold text-ink">{legend}</legend>
      <div className={inline ? 'flex flex-wrap gap-x-5 gap-y-1.5 text-sm' : 'space-y-2 text-sm'}>
        {choices.map(([choice, label, hint]) => (
          <label key={choice} className={inline ? 'inline-flex items-center gap-2' : 'flex items-start gap-2.5'}>
            <input
              type="radio"
              name={name}
              value={choice}
              checked={value === choice}
              onChange={() => onChange(choice)}
              className={inline ? 'size-4 accent-copper' : 'mt-0.5 size-4 shrink-0 accent-copper'}
            />
            {inline ? (
              label
            ) : (
              <span>
                <span className="font-medium text-ink">{label}</span>
                <span className="block text-[0.8125rem] text-muted">{hint}</span>
              </span>
            )}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
