import { useState, type FormEvent } from 'react';
import { z } from 'zod';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { Select } from '../../../components/ui/select';
import { TextArea } from '../../../components/ui/text-area';
import { TextField } from '../../../components/ui/text-field';
import { isApiError } from '../../../lib/api-client';
import { formatCalendarDate, formatSlot } from '../../../lib/format-time';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';
import { useZodForm } from '../../../lib/use-zod-form';
import { formSchema } from '../../../lib/form-schema';
import {
  createBookingRequestSchema,
  MAX_BOOKING_HOURS,
  type Bench,
  type Booking,
} from '../../../../shared/schemas/benches';
import type { QueueItem } from '../../../../shared/schemas/matrix';
import { idSchema } from '../../../../shared/schemas/planning-fields';
import { useBookBench } from '../api/book-bench';
import { instantFromLocalInput, localInputValue, zoneLabel } from './booking-time';

const labels = {
  benchId: 'Bench',
  startsAt: 'Starts',
  endsAt: 'Ends',
  cellIds: 'Your cells this slot is for',
  note: 'Note',
  overrideReason: 'Why book it anyway',
};

/** The bench travels in the path; the rest is the shared booking request. */
const bookingTarget = z.object({ benchId: idSchema, booking: createBookingRequestSchema });

/**
 * Wall times typed in the device's zone become UTC instants; the chosen cells travel as a comma list in the
 * form's text values. The shared booking schema checks the slot (ends after it starts, at most 72 h) in the same
 * pass, so every problem shows at once.
 */
const bookingFormSchema = formSchema(
  bookingTarget,
  (
    values: {
      benchId: string;
      startsAt: string;
      endsAt: string;
      cellIds: string;
      note: string;
      overrideReason: string;
    },
    flag,
  ): z.input<typeof bookingTarget> => {
    const startsAt = instantFromLocalInput(values.startsAt);
    const endsAt = instantFromLocalInput(values.endsAt);
    if (!values.benchId) flag('benchId', 'Choose a bench.');
    if (!startsAt) flag('startsAt', 'Enter the date and time it starts.');
    if (!endsAt) flag('endsAt', 'Enter the date and time it ends.');
    if (!values.cellIds) flag('cellIds', 'Choose the assigned cells this slot is for.');
    return {
      benchId: Number(values.benchId),
      booking: {
        startsAt: startsAt ?? '',
        endsAt: endsAt ?? '',
        cellIds: values.cellIds ? values.cellIds.split(',').map(Number) : [],
        note: values.note,
        overrideReason: values.overrideReason,
      },
    };
  },
  (path) => path.replace(/^booking\./, ''),
);

export interface BookingFormProps {
  benches: readonly Bench[];
  /** Cells assigned to the tester that can still be booked (assigned, running, needs retest). */
  cells: readonly QueueItem[];
  /** Preselected bench (e.g. the one the calendar is filtered to). */
  initialBenchId?: number | null;
  /** Suggested start, e.g. the next whole hour; given by the page so rendering stays pure. */
  suggestedStart: Date;
  onBooked?: (booking: Booking) => void;
}

/**
 * A tester books a bench for a slot against their own assigned cells; the same form on the Benches page and on
 * My bench. Times are typed in the device's zone and sent as UTC instants. A refused slot (the bench or a cell is
 * taken) keeps everything typed, with the server's reason on top. When the bench's set-up differs from a roundup's
 * bench profile the server lists the differences first; the tester can book anyway with a written reason.
 */
export function BookingForm({ benches, cells, initialBenchId = null, suggestedStart, onBooked }: BookingFormProps) {
  const book = useBookBench();
  const active = benches.filter((bench) => bench.active);
  const [initialValues] = useState(() => ({
    benchId:
      initialBenchId !== null && active.some((bench) => bench.id === initialBenchId)
        ? String(initialBenchId)
        : active.length === 1
          ? String(active[0].id)
          : '',
    startsAt: localInputValue(suggestedStart),
    endsAt: localInputValue(new Date(suggestedStart.getTime() + 2 * 3_600_000)),
    cellIds: '',
    note: '',
    overrideReason: '',
  }));
  const form = useZodForm({ schema: bookingFormSchema, initialValues, labels });
  // The server's whole sentence for a refused slot (who holds the bench, when); the field error is shorter.
  const [refusal, setRefusal] = useState<string | null>(null);
  // The differences between the bench and the roundup's profile, once the server has named them.
  const [mismatch, setMismatch] = useState<string | null>(null);
  const [booked, setBooked] = useState<Booking | null>(null);
  const zone = zoneLabel(suggestedStart.getTime());
  const chosen = new Set(form.values.cellIds ? form.values.cellIds.split(',').map(Number) : []);

  const toggleCell = (cellId: number, on: boolean) => {
    const next = new Set(chosen);
    if (on) next.add(cellId);
    else next.delete(cellId);
    form.setValue('cellIds', [...next].join(','));
  };

  // A different bench, slot or set of cells is a different question: the warning no longer applies.
  const change = (name: 'benchId' | 'startsAt' | 'endsAt') => (value: string) => {
    form.setValue(name, value);
    setRefusal(null);
    if (name === 'benchId') setMismatch(null);
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setRefusal(null);
    setBooked(null);
    const input = form.validate();
    if (!input) return;
    const { benchId, booking } = input;
    book.mutate(
      { benchId, booking: mismatch ? booking : { ...booking, overrideReason: null } },
      {
        onSuccess: (saved) => {
          setMismatch(null);
          setBooked(saved);
          form.reset({ ...form.values, cellIds: '', note: '', overrideReason: '' });
          onBooked?.(saved);
        },
        onError: (error) => {
          form.fail(error);
          if (isApiError(error) && error.code === 'bench_profile_mismatch') setMismatch(error.message);
          else if (isApiError(error) && error.status === 409) setRefusal(error.message);
        },
      },
    );
  };

  if (active.length === 0) {
    return <p className="text-sm text-muted">No bench is in service, so nothing can be booked now.</p>;
  }

  return (
    <form noValidate onSubmit={submit} className="space-y-4" aria-label="Book a bench">
      {booked && (
        <Alert tone="success" announce>
          Booked {booked.bench.name}, {formatSlot(booked.startsAt, booked.endsAt)} ({zone}), for {booked.cells.length}{' '}
          cell{booked.cells.length === 1 ? '' : 's'}.
        </Alert>
      )}
      <FormErrorSummary
        title="This slot was not booked"
        items={form.summaryItems}
        message={refusal ?? form.formError}
        attempt={form.attempt}
      />

      <Select
        {...form.field('benchId')}
        onChange={(event) => change('benchId')(event.target.value)}
        placeholder="Choose a bench…"
        options={active.map((bench) => ({
          value: String(bench.id),
          label: bench.location ? `${bench.name} (${bench.location})` : bench.name,
        }))}
      />
      {/* Each time field gets a row of its own when two do not fit side by side (a narrow panel, a phone). */}
      <div className="grid grid-cols-[repeat(auto-fit,minmax(15.5rem,1fr))] gap-3">
        <TextField
          {...form.field('startsAt')}
          onChange={(event) => change('startsAt')(event.target.value)}
          type="datetime-local"
          step={900}
        />
        <TextField
          {...form.field('endsAt')}
          onChange={(event) => change('endsAt')(event.target.value)}
          type="datetime-local"
          step={900}
        />
      </div>
      <p className="-mt-2 text-[0.8125rem] text-muted">
        In {zone}. At most {MAX_BOOKING_HOURS} hours per booking; slots may touch but not overlap.
      </p>

      <fieldset
        id={form.fieldId('cellIds')}
        tabIndex={-1}
        aria-describedby={form.errors.cellIds ? `${form.fieldId('cellIds')}-error` : undefined}
        className="outline-none"
      >
        <legend className="mb-1.5 text-sm font-semibold text-ink">{labels.cellIds}</legend>
        {form.errors.cellIds && (
          <p id={`${form.fieldId('cellIds')}-error`} className="mb-1.5 flex gap-1.5 text-sm font-medium text-red">
            <span aria-hidden="true">✕</span>
            <span>{form.errors.cellIds}</span>
          </p>
        )}
        {cells.length === 0 ? (
          <p className="text-sm text-muted">
            You have no assigned cells to book time for. An editor assigns cells in a roundup’s test matrix.
          </p>
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
                      {productDisplayName(item.product)} · {item.loadConfiguration.name}
                    </span>
                    <span className="block text-xs text-muted">
                      {item.roundup.title}
                      {item.cell.dueDate && ` · due ${formatCalendarDate(item.cell.dueDate)}`}
                      {item.cell.overdue && ' · overdue'}
                    </span>
                  </label>
                </li>
              );
            })}
          </ul>
        )}
      </fieldset>

      <TextArea
        {...form.field('note')}
        onChange={(event) => form.setValue('note', event.target.value)}
        optional
        rows={2}
        maxLength={300}
        description="Anything the next person at the bench should know."
      />

      {mismatch && (
        <div className="space-y-3">
          <Alert tone="warning" title="This bench is not set up as the roundup asks">
            {mismatch}
          </Alert>
          <TextArea
            {...form.field('overrideReason')}
            onChange={(event) => form.setValue('overrideReason', event.target.value)}
            rows={2}
            maxLength={300}
            description="Kept with the booking, so the editor can see why the set-up differs."
          />
        </div>
      )}
      <Button type="submit" variant="primary" pending={book.isPending}>
        {mismatch ? 'Book anyway' : 'Book this slot'}
      </Button>
    </form>
  );
}
