import { useId, useState, type FormEvent } from 'react';
import { Alert } from '../../../components/ui/alert';
import { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import { isApiError } from '../../../lib/api-client';
import { formatCalendarDate, userTimeZone } from '../../../lib/format-time';
import { useZodForm } from '../../../lib/use-zod-form';
import {
  createBookingRequestSchema,
  MAX_BOOKING_HOURS,
  type Bench,
  type Booking,
} from '../../../../shared/schemas/benches';
import { idSchema } from '../../../../shared/schemas/planning-fields';
import type { QueueItem } from '../../../../shared/schemas/matrix';
import { useBookBench } from '../api/book-bench';
import { productName } from '../../../lib/product-name';
import { localInputToInstant } from './bench-format';

const emptyForm = { benchId: '', startsAt: '', endsAt: '', cellIds: '', note: '' };
const labels = {
  benchId: 'Bench',
  startsAt: 'Starts',
  endsAt: 'Ends',
  cellIds: 'Cells this slot is for',
  note: 'Note',
};

const bookingTarget = z.object({ benchId: idSchema }).and(createBookingRequestSchema);

/**
 * Wall times typed in the device's zone become UTC instants; the chosen cells travel as a comma list in the
 * form's text values. The shared booking schema then checks the slot (ends after it starts, at most 72 h).
 */
const bookingFormSchema = z
  .object({ benchId: z.string(), startsAt: z.string(), endsAt: z.string(), cellIds: z.string(), note: z.string() })
  .transform((values, ctx): z.input<typeof bookingTarget> => {
    const startsAt = localInputToInstant(values.startsAt);
    const endsAt = localInputToInstant(values.endsAt);
    if (!values.benchId) ctx.addIssue({ code: 'custom', path: ['benchId'], message: 'Choose a bench.' });
    if (!startsAt) ctx.addIssue({ code: 'custom', path: ['startsAt'], message: 'Enter the date and time it starts.' });
    if (!endsAt) ctx.addIssue({ code: 'custom', path: ['endsAt'], message: 'Enter the date and time it ends.' });
    if (!values.cellIds)
      ctx.addIssue({ code: 'custom', path: ['cellIds'], message: 'Choose the assigned cells this slot is for.' });
    return {
      benchId: Number(values.benchId),
      startsAt: startsAt ?? '',
      endsAt: endsAt ?? '',
      cellIds: values.cellIds ? values.cellIds.split(',').map(Number) : [],
      note: values.note,
    };
  })
  .pipe(bookingTarget);

export interface BookBenchFormProps {
  benches: readonly Bench[];
  /** Cells assigned to the tester that can still be booked (assigned, running, needs retest). */
  cells: readonly QueueItem[];
  onBooked: (booking: Booking) => void;
}

/** Books bench time for assigned cells. A refused slot (another booking overlaps) keeps everything typed. */
export function BookBenchForm({ benches, cells, onBooked }: BookBenchFormProps) {
  const cellsHeadingId = useId();
  const book = useBookBench();
  const form = useZodForm({ schema: bookingFormSchema, initialValues: emptyForm, labels });
  // The server's whole sentence for a refused slot (who holds the bench, when); the field error is shorter.
  const [refusal, setRefusal] = useState<string | null>(null);
  const zone = userTimeZone();
  const activeBenches = benches.filter((bench) => bench.active);
  const chosen = new Set(form.values.cellIds ? form.values.cellIds.split(',').map(Number) : []);

  const toggleCell = (cellId: number, on: boolean) => {
    const next = new Set(chosen);
    if (on) next.add(cellId);
    else next.delete(cellId);
    form.setValue('cellIds', [...next].join(','));
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setRefusal(null);
    const input = form.validate();
    if (!input) return;
    const { benchId, ...booking } = input;
    book.mutate(
      { benchId, booking },
      {
        onSuccess: (saved) => {
          form.reset();
          onBooked(saved);
        },
        onError: (error) => {
          form.fail(error);
          if (isApiError(error) && error.status === 409) setRefusal(error.message);
        },
      },
    );
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-4" aria-label="Book a bench">
      <FormErrorSummary
        title="The bench was not booked"
        items={form.summaryItems}
        message={form.formError}
        attempt={form.attempt}
      />
      <Select
        {...form.field('benchId')}
        options={activeBenches.map((bench) => ({
          value: String(bench.id),
          label: bench.location ? `${bench.name} (${bench.location})` : bench.name,
        }))}
        placeholder={activeBenches.length ? 'Choose a bench…' : 'No bench is in service'}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField {...form.field('startsAt')} type="datetime-local" step={900} />
        <TextField {...form.field('endsAt')} type="datetime-local" step={900} />
      </div>
      <p className="-mt-2 text-[0.8125rem] text-muted">
        Times are in your time zone, <strong className="font-semibold text-ink">{zone}</strong>. One slot is at most{' '}
        {MAX_BOOKING_HOURS} hours; slots on a bench may touch but not overlap.
      </p>

      <fieldset
        id={form.fieldId('cellIds')}
        tabIndex={-1}
        aria-describedby={form.errors.cellIds ? `${form.fieldId('cellIds')}-error` : undefined}
        className="outline-none"
      >
        <legend id={cellsHeadingId} className="mb-1 text-sm font-semibold text-ink">
          {labels.cellIds}
        </legend>
        {form.errors.cellIds && (
          <p id={`${form.fieldId('cellIds')}-error`} className="mb-1 flex gap-1.5 text-sm font-medium text-red">
            <span aria-hidden="true">✕</span>
            <span>{form.errors.cellIds}</span>
          </p>
        )}
        {cells.length === 0 ? (
          <p className="text-sm text-muted">No assigned cells to book time for.</p>
        ) : (
          <ul className="max-h-72 divide-y divide-rule overflow-y-auto rounded-[3px] border border-rule">
            {cells.map((item) => {
              const id = `${form.fieldId('cellIds')}-${item.cell.id}`;
              return (
                <li key={item.cell.id} className="flex items-start gap-2.5 px-3 py-2">
                  <input
                    id={id}
                    type="checkbox"
                    checked={chosen.has(item.cell.id)}
                    onChange={(event) => toggleCell(item.cell.id, event.target.checked)}
                    className="mt-0.5 size-4.5 shrink-0 accent-copper"
                  />
                  <label htmlFor={id} className="text-sm">
                    <span className="font-medium">
                      {productName(item.product)} · {item.loadConfiguration.name}
                    </span>
                    <span className="block text-xs text-muted">
                      {item.roundup.title}
                      {item.cell.dueDate && ` · due ${formatCalendarDate(item.cell.dueDate)}`}
                    </span>
                  </label>
                </li>
              );
            })}
          </ul>
        )}
      </fieldset>

      <TextField {...form.field('note')} optional autoComplete="off" maxLength={300} />
      {refusal && (
        <Alert tone="danger" title="That slot is taken">
          {refusal}
        </Alert>
      )}
      <Button type="submit" variant="primary" pending={book.isPending}>
        Book the bench
      </Button>
    </form>
  );
}
