import { useId } from 'react';
import { Button } from '../../../components/ui/button';
import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import type { PersonRef } from '../../../../shared/schemas/planning-fields';

export interface AssignBarProps {
  chosenCount: number;
  testers: readonly PersonRef[] | undefined;
  testerId: string;
  dueDate: string;
  timeZone: string;
  errors: { testerId?: string; dueDate?: string; cellIds?: string };
  pending: boolean;
  onTesterChange: (value: string) => void;
  onDueDateChange: (value: string) => void;
  onAssign: () => void;
  onClear: () => void;
}

/** The editor's assignment controls: who tests the chosen cells, and by when. */
export function AssignBar({
  chosenCount,
  testers,
  testerId,
  dueDate,
  timeZone,
  errors,
  pending,
  onTesterChange,
  onDueDateChange,
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
          · {chosenCount === 0 ? 'no cells chosen yet' : `${chosenCount} cell${chosenCount === 1 ? '' : 's'} chosen`}
        </span>
      </p>
      {errors.cellIds && (
        <p className="mt-1 flex gap-1.5 text-sm font-medium text-red">
          <span aria-hidden="true">✕</span>
          <span>{errors.cellIds}</span>
        </p>
      )}
      <p className="mt-0.5 text-[0.8125rem] text-muted">
        Choose cells, or a whole row with the box beside the product. Cells that are running, recorded or accepted keep
        their tester.
      </p>
      <div className="mt-2 flex flex-wrap items-start gap-3">
        <Select
          label="Tester"
          options={(testers ?? []).map((tester) => ({ value: String(tester.id), label: tester.displayName }))}
          placeholder={testers ? 'Choose a tester…' : 'Loading testers…'}
          value={testerId}
          onChange={(event) => onTesterChange(event.target.value)}
          error={errors.testerId}
          className="w-full sm:w-56"
        />
        <TextField
          label="Due date"
          type="date"
          value={dueDate}
          onChange={(event) => onDueDateChange(event.target.value)}
          error={errors.dueDate}
          description={`Ends at midnight, ${timeZone}.`}
          className="w-full sm:w-48"
        />
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
