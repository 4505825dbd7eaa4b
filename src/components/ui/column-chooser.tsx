import { useDisclosureEscape } from '../../lib/use-disclosure-escape';
import type { ColumnChoice } from '../../lib/use-column-choice';
import { Button } from './button';
import { Checkbox } from './checkbox';

export interface ChoosableColumn {
  id: string;
  /** Name in the chooser. */
  label: string;
  defaultVisible: boolean;
}

export interface ColumnChooserProps extends ColumnChoice {
  /** The columns the user may switch on and off (not the row header or the actions). */
  columns: readonly ChoosableColumn[];
}

/** A disclosure with one checkbox per column; the choice is remembered on this device. */
export function ColumnChooser({ columns, isVisible, setVisible, reset }: ColumnChooserProps) {
  const escape = useDisclosureEscape();
  const visibleCount = columns.filter((column) => isVisible(column.id, column.defaultVisible)).length;

  return (
    <details {...escape} className="group relative">
      <summary className="inline-flex min-h-9 cursor-pointer list-none items-center gap-2 rounded-[3px] border border-edge bg-surface px-3.5 text-sm font-medium text-ink hover:bg-wash [&::-webkit-details-marker]:hidden">
        Columns
        <span className="numeric text-muted">
          {visibleCount}/{columns.length}
        </span>
        <span aria-hidden="true" className="font-mono text-[0.625rem] group-open:rotate-180">
          ▼
        </span>
      </summary>
      <div className="absolute left-0 z-20 mt-1 w-[min(20rem,calc(100vw-2rem))] rounded-[3px] border border-edge bg-surface p-3 shadow-[0_12px_30px_-12px_rgb(16_22_31/0.45)]">
        <fieldset>
          <legend className="mb-2 text-sm font-semibold text-ink">Show these columns</legend>
          <div className="max-h-[min(24rem,60vh)] space-y-1.5 overflow-y-auto pr-1">
            {columns.map((column) => (
              <Checkbox
                key={column.id}
                label={column.label}
                checked={isVisible(column.id, column.defaultVisible)}
                onChange={(event) => setVisible(column.id, column.defaultVisible, event.target.checked)}
              />
            ))}
          </div>
        </fieldset>
        <div className="mt-3 flex justify-between gap-2 border-t border-rule pt-2.5">
          <p className="text-xs text-muted">Remembered on this device.</p>
          <Button size="sm" variant="quiet" onClick={reset}>
            Reset
          </Button>
        </div>
      </div>
    </details>
  );
}
