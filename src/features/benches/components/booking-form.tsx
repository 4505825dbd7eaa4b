import { useCallback, useId, useMemo, useState, type FormEvent } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Checkbox } from '../../../components/ui/checkbox';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import { isApiError } from '../../../lib/api-client';
import { describeSubmitError, zodFieldErrors, type FormErrorItem } from '../../../lib/form-errors';
import {
  createBookingRequestSchema,
  MAX_BOOKING_HOURS,
  type Bench,
  type Booking,
} from '../../../../shared/schemas/benches';
import type { QueueItem } from '../../../../shared/schemas/matrix';
import { useBookBench } from '../api/bookings';
import { formatDayHeading, formatDueDate, formatSlot, instantFromLocalInput, localInputValue } from './bench-time';
import { TextArea } from '../../../components/ui/text-area';

type Field = 'benchId' | 'startsAt' | 'endsAt' | 'cellIds' | 'note';
const labels: Record<Field, string> = {
  benchId: 'Bench',
  startsAt: 'Starts',
  endsAt: 'Ends',
  cellIds: 'Cells',
  note: 'Note',
};

export interface BookingFormProps {
  benches: readonly Bench[];
  cells: readonly QueueItem[];
  /** Preselected bench (the one the page is filtered to). */
  initialBenchId: number | null;
  /** Suggested start, e.g. the next whole hour; given by the page so rendering stays pure. */
  suggestedStart: Date;
  zoneLabel: string;
  onBooked: (booking: Booking) => void;
}

/**
 * A tester books a bench for a slot against their own assigned cells. Times are typed in the device's zone and sent
 * as UTC instants. A refused slot (the bench is taken) keeps everything typed, with the server's reason on top.
 */
export function BookingForm({ benches, cells, initialBenchId, suggestedStart, zoneLabel, onBooked }: BookingFormProps) {
  const formId = useId();
  const book = useBookBench();
  const active = benches.filter((bench) => bench.active);
  const [benchId, setBenchId] = useState(() =>
    initialBenchId !== null && active.some((bench) => bench.id === initialBenchId)
      ? String(initialBenchId)
      : active.length === 1
        ? String(active[0].id)
        : '',
  );
  const [startsAt, setStartsAt] = useState(() => localInputValue(suggestedStart));
  const [endsAt, setEndsAt] = useState(() => localInputValue(new Date(suggestedStart.getTime() + 2 * 3_600_000)));
  const [cellIds, setCellIds] = useState<number[]>([]);
  const [note, setNote] = useState('');
  const [errors, setErrors] = useState<Partial<Record<Field, string>>>({});
  const [refusal, setRefusal] = useState<string | null>(null);
  const [attempt, setAttempt] = useState(0);
  const [booked, setBooked] = useState<Booking | null>(null);
  const id = useCallback((field: Field) => `${formId}-${field}`, [formId]);

  const clearError = (field: Field) =>
    setErrors((current) => {
      if (!(field in current)) return current;
      const next = { ...current };
      delete next[field];
      return next;
    });

  const summaryItems: FormErrorItem[] = useMemo(
    () =>
      (Object.keys(labels) as Field[])
        .filter((field) => errors[field])
        .map((field) => ({ fieldId: id(field), label: labels[field], message: errors[field] as string })),
    [errors, id],
  );

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setRefusal(null);
    setBooked(null);
    const found: Partial<Record<Field, string>> = {};
    if (!benchId) found.benchId = 'Choose a bench.';
    const start = instantFromLocalInput(startsAt);
    const end = instantFromLocalInput(endsAt);
    if (!start) found.startsAt = 'Enter the date and time the slot starts.';
    if (!end) found.endsAt = 'Enter the date and time the slot ends.';
    const request = { startsAt: start ?? '', endsAt: end ?? '', cellIds, note };
    const parsed = createBookingRequestSchema.safeParse(request);
    if (!parsed.success) {
      const fromSchema = zodFieldErrors(parsed.error);
      for (const field of ['startsAt', 'endsAt', 'cellIds', 'note'] as const) {
        if (!found[field] && fromSchema[field]) found[field] = fromSchema[field];
      }
    }
    if (Object.keys(found).length > 0 || !parsed.success) {
      setErrors(found);
      setAttempt((count) => count + 1);
      return;
    }
    setErrors({});
    book.mutate(
      { benchId: Number(benchId), booking: parsed.data },
      {
        onSuccess: (booking) => {
          setBooked(booking);
          setCellIds([]);
          setNote('');
          onBooked(booking);
        },
        onError: (error) => {
          const { fields, message } = describeSubmitError(error);
          const next: Partial<Record<Field, string>> = {};
          for (const [name, text] of Object.entries(fields)) if (name in labels) next[name as Field] = text;
          setErrors(next);
          // An overlap (409) or a closed bench is about the slot as a whole: say it first, in the server's words.
          if (isApiError(error) && (error.status === 409 || Object.keys(next).length === 0)) setRefusal(message);
          setAttempt((count) => count + 1);
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
        <Alert tone="success" announce title="Booked">
          {booked.bench.name}, {formatDayHeading(new Date(booked.startsAt))}{' '}
          {formatSlot(booked.startsAt, booked.endsAt)} ({zoneLabel}).
        </Alert>
      )}
      <FormErrorSummary
        title="This slot was not booked"
        items={summaryItems}
        message={refusal ?? undefined}
        attempt={attempt}
      />

      <Select
        id={id('benchId')}
        label={labels.benchId}
        placeholder="Choose a bench…"
        options={active.map((bench) => ({
          value: String(bench.id),
          label: bench.location ? `${bench.name} (${bench.location})` : bench.name,
        }))}
        value={benchId}
        error={errors.benchId}
        onChange={(event) => {
          setBenchId(event.target.value);
          clearError('benchId');
          setRefusal(null);
        }}
      />
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField
          id={id('startsAt')}
          label={labels.startsAt}
          type="datetime-local"
          step={900}
          value={startsAt}
          error={errors.startsAt}
          onChange={(event) => {
            setStartsAt(event.target.value);
            clearError('startsAt');
            setRefusal(null);
          }}
        />
        <TextField
          id={id('endsAt')}
          label={labels.endsAt}
          type="datetime-local"
          step={900}
          value={endsAt}
          error={errors.endsAt}
          onChange={(event) => {
            setEndsAt(event.target.value);
            clearError('endsAt');
            setRefusal(null);
          }}
        />
      </div>
      <p className="-mt-2 text-[0.8125rem] text-muted">
        In {zoneLabel}. At most {MAX_BOOKING_HOURS} hours per booking; slots may touch but not overlap.
      </p>

      <fieldset
        id={id('cellIds')}
        tabIndex={-1}
        aria-describedby={errors.cellIds ? `${id('cellIds')}-error` : undefined}
        className="outline-none"
      >
        <legend className="mb-1.5 text-sm font-semibold text-ink">Your cells this slot is for</legend>
        {errors.cellIds && (
          <p id={`${id('cellIds')}-error`} className="mb-1.5 flex gap-1.5 text-sm font-medium text-red">
            <span aria-hidden="true">✕</span>
            <span>{errors.cellIds}</span>
          </p>
        )}
        {cells.length === 0 ? (
          <p className="text-sm text-muted">
            You have no assigned cells to book time for. An editor assigns cells in a roundup’s test matrix.
          </p>
        ) : (
          <div className="max-h-64 space-y-2 overflow-y-auto pr-1">
            {cells.map((item) => (
              <Checkbox
                key={item.cell.id}
                label={`${item.product.maker} ${item.product.model} · ${item.loadConfiguration.name}`}
                description={`${item.roundup.title}${item.cell.dueDate ? ` · due ${formatDueDate(item.cell.dueDate)}` : ''}${item.cell.overdue ? ' · overdue' : ''}`}
                checked={cellIds.includes(item.cell.id)}
                onChange={(event) => {
                  setCellIds((current) =>
                    event.target.checked
                      ? [...current, item.cell.id]
                      : current.filter((cellId) => cellId !== item.cell.id),
                  );
                  clearError('cellIds');
                }}
              />
            ))}
          </div>
        )}
      </fieldset>

      <TextArea
        id={id('note')}
        label={labels.note}
        optional
        rows={2}
        value={note}
        error={errors.note}
        description="Anything the next person at the bench should know."
        onChange={(event) => {
          setNote(event.target.value);
          clearError('note');
        }}
      />
      <Button type="submit" variant="primary" pending={book.isPending} disabled={cells.length === 0}>
        Book this slot
      </Button>
    </form>
  );
}
