import { useId, type ChangeEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import { countOf } from '../../../lib/plural';
import type { PersonRef } from '../../../../shared/schemas/planning-fields';

/** A form field's props as `useZodForm().field(name)` gives them. */
interface FieldProps {
  id: string;
  name: string;
  label: string;
  value: string;
  error?: string;
  onChange: (event: ChangeEvent<HTMLInputElement | HTMLSelectElement>) => void;
}

export interface AssignBarProps {
  chosenCount: number;
  testers: readonly PersonRef[] | undefined;
  tester: FieldProps;
  dueDate: FieldProps;
  timeZone: string;
  /** No cell or row is chosen. */
  cellsError?: string;
  pending: boolean;
  onAssign: () => void;
  onClear: () => void;
}

/** The editor's assignment controls: who tests the chosen cells, and by when. */
export function AssignBar({
  chosenCount,
  testers,
  tester,
  dueDate,
  timeZone,
  cellsError,
  pending,
  onAssign,
  onClear,
}: AssignBarProps) {
  const headingId = useId();
  return (
    <div
      role="group"
      aria-labelledby={headingId}
      className="mb-3 rounded-[3px] border border-rule bg-wash/60 px-3 py-3"
    >
      <p id={headingId} className="text-sm font-semibold">
        Assign to a tester{' '}
        <span aria-live="polite" className="font-normal text-muted">
          · {chosenCount === 0 ? 'no cells chosen yet' : `${countOf(chosenCount, 'cell', 'cells')} chosen`}
        </span>
      </p>
      {cellsError && (
        <p role="alert" className="mt-1 flex gap-1.5 text-sm font-medium text-red">
          <span aria-hidden="true">✕</span>
          <span>{cellsError}</span>
        </p>
      )}
      <p className="mt-0.5 text-[0.8125rem] text-muted">
        Choose cells, or a whole row with the box beside the product. Cells that are running, recorded or accepted keep
        their tester.
      </p>
      <div className="mt-2 flex flex-wrap items-start gap-3">
        <Select
          {...tester}
          options={(testers ?? []).map((person) => ({ value: String(person.id), label: person.displayName }))}
          placeholder={testers ? 'Choose a tester…' : 'Loading testers…'}
          className="w-full sm:w-56"
        />
        <TextField {...dueDate} type="date" description={`Ends at midnight, ${timeZone}.`} className="w-full sm:w-48" />
        <div className="flex gap-2 sm:mt-6">
          <Button variant="primary" onClick={onAssign} pending={pending}>
            Assign chosen cells
          </Button>
          <Button variant="quiet" onClick={onClear} disabled={chosenCount === 0}>
            Clear choice
          </Button>
        </div>
      </div>
    </div>
  );
}
