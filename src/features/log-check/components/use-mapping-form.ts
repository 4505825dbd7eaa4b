import { useId, useState, type FormEvent } from 'react';
import type { FormErrorItem } from '../../../lib/form-errors';
import type { AnalysisRequestInput, LogPreview } from '../../../../shared/schemas/analysis';
import {
  requestFromDraft,
  temperatureColumns,
  unitOf,
  type DraftErrors,
  type DraftField,
  type MappingDraft,
} from './mapping-draft';
import { optionFigures, type OptionFigure, type OptionFigureName } from './option-figures';

export interface UseMappingFormOptions {
  preview: LogPreview;
  draft: MappingDraft;
  /** The draft as the server guessed it, to mark fields the tester has not yet changed. */
  guess: MappingDraft | null;
  onChange: (draft: MappingDraft) => void;
  onAnalyse: (request: AnalysisRequestInput) => void;
  disabled: boolean;
}

const figures: readonly OptionFigure[] = optionFigures;

/** Labels of every field that can carry an error, in the order the form shows them (the error summary's order). */
export const fieldLabels: Partial<Record<DraftField, string>> = {
  time: 'Time column',
  vrm: 'VRM probe columns',
  ambient: 'Ambient column',
  clock: 'Clock column',
  power: 'Package power column',
  coldJunction: 'Cold junction',
  coldJunctionFixedC: 'Cold-junction temperature',
  coldJunctionColumn: 'Cold-junction column',
  toleranceClass: 'Thermocouple tolerance class',
  ...Object.fromEntries(figures.map((figure) => [figure.name, figure.label])),
};

/**
 * The mapping form's own state: its errors and their summary, the field ids, and the moves that change the draft.
 * The draft itself belongs to the log check (it survives a new file with the same header); this only edits it.
 * Like useZodForm, it checks every field in one pass with the shared schema and keeps everything typed on failure.
 */
export function useMappingForm({ preview, draft, guess, onChange, onAnalyse, disabled }: UseMappingFormOptions) {
  const formId = useId();
  const [errors, setErrors] = useState<DraftErrors>({});
  const [attempt, setAttempt] = useState(0);
  const id = (field: string) => `${formId}-${field.replace(/[^a-z0-9-]/gi, '_')}`;
  const names = preview.columns.map((column) => column.name);
  const columnOptions = preview.columns.map((column) => ({
    value: column.name,
    label: `${column.index + 1} · ${column.name || '(no name)'}`,
  }));

  /** Applies a change to the draft and clears the errors of the fields it touched. */
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

  /** Props for the TextField of one figure option: decimal keypad on phones, right-aligned tabular digits. */
  const figureField = (figure: OptionFigure) => {
    const name = figure.name as OptionFigureName;
    const inapplicable = figure.inapplicable?.(draft) ?? null;
    return {
      id: id(name),
      label: figure.label,
      value: draft[name],
      error: errors[name],
      optional: figure.optional,
      description: inapplicable ?? figure.description,
      disabled: disabled || inapplicable !== null,
      inputMode: 'decimal',
      autoComplete: 'off',
      inputClassName: 'text-right font-mono',
      onChange: (event: { target: { value: string } }) => update({ [name]: event.target.value }, [name]),
    } as const;
  };

  const isGuessed = (role: 'time' | 'ambient' | 'clock' | 'power') =>
    Boolean(guess && guess[role] && draft[role] === guess[role]);
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

  const summaryItems: FormErrorItem[] = (Object.keys(fieldLabels) as DraftField[])
    .filter((field) => errors[field])
    .map((field) => ({
      fieldId: field === 'vrm' ? id(`vrm-${names.find((name) => name !== draft.time) ?? ''}`) : id(field),
      label: fieldLabels[field] as string,
      message: errors[field] as string,
    }));

  const temperatures = temperatureColumns(draft, preview);
  // A role offers the columns no other role holds, plus its own choice so an error beside it still makes sense.
  const optionsFor = (role: 'ambient' | 'clock' | 'power') =>
    columnOptions.filter(
      (option) => option.value === draft[role] || (option.value !== draft.time && !draft.vrm.includes(option.value)),
    );

  return {
    preview,
    draft,
    disabled,
    errors,
    attempt,
    id,
    names,
    columnOptions,
    optionsFor,
    update,
    figureField,
    isGuessed,
    vrmGuessed,
    submit,
    summaryItems,
    temperatures,
    usesMillivolts: temperatures.some((column) => unitOf(draft, preview, column) === 'mV'),
  };
}

export type MappingForm = ReturnType<typeof useMappingForm>;
