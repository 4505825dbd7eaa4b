import { useState } from 'react';
import { Link, useSearchParams } from 'react-router';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';
import { Panel } from '../../../components/ui/panel';
import { Select } from '../../../components/ui/select';
import { userTimeZone, zoneAbbreviation } from '../../../lib/format-time';
import type { Bench, Booking } from '../../../../shared/schemas/benches';
import type { QueueItem } from '../../../../shared/schemas/matrix';
import type { BenchProfileOption } from '../api/get-bench-profiles';
import { useBenches } from '../api/get-benches';
import { useBookings } from '../api/get-bookings';
import { BenchCautions } from './bench-cautions';
import { BenchDialog } from './bench-dialog';
import { BenchesTable } from './benches-table';
import { dateParam, formatDayHeading, startOfWeek, weekFromParams } from './bench-time';
import { BookingAgenda } from './booking-agenda';
import { BookingForm } from './booking-form';

export interface BenchesOverviewProps {
  currentUserId: number;
  /** Editors add and edit benches. */
  canManage: boolean;
  /** Bench testers book slots; these are their bookable cells (null for other roles). */
  bookableCells: readonly QueueItem[] | null;
  /** Bench profiles for the bench form (editors only). */
  profiles: readonly BenchProfileOption[];
  /** The moment the page was opened, from the loader (keeps rendering pure). */
  openedAt: number;
}

export function BenchesOverview({ currentUserId, canManage, bookableCells, profiles, openedAt }: BenchesOverviewProps) {
  const [params, setParams] = useSearchParams();
  const benches = useBenches();
  const { weekStart, from, to } = weekFromParams(params, openedAt);
  const bookings = useBookings({ from, to });
  const [dialog, setDialog] = useState<{ bench: Bench | null; open: boolean }>({ bench: null, open: false });
  const [notice, setNotice] = useState<string | null>(null);
  const [lastBooking, setLastBooking] = useState<Booking | null>(null);

  const requestedBench = Number(params.get('bench'));
  const benchId = benches.some((bench) => bench.id === requestedBench) ? requestedBench : null;
  const zone = userTimeZone();
  const abbreviation = zoneAbbreviation(new Date(openedAt).toISOString());
  const zoneLabel = abbreviation && abbreviation !== zone ? `${zone} (${abbreviation})` : zone;
  const today = dateParam(new Date(openedAt));
  const nextHour = new Date(openedAt);
  nextHour.setHours(nextHour.getHours() + 1, 0, 0, 0);

  const weekHref = (date: Date) => {
    const next = new URLSearchParams(params);
    next.set('week', dateParam(startOfWeek(date)));
    return `?${next}`;
  };

  const startEditing = (bench: Bench) => {
    setNotice(null);
    setDialog({ bench, open: true });
  };

  const lastBookingWeek = lastBooking ? dateParam(startOfWeek(new Date(lastBooking.startsAt))) : null;

  return (
    <>
      <PageHeader
        eyebrow="Lab"
        title="Benches"
        description={
          bookableCells
            ? 'The physical test systems and who has them when. Book time against the cells assigned to you.'
            : 'The physical test systems and who has them when. Bench testers book time against their assigned cells.'
        }
        actions={
          canManage ? (
            <Button
              variant="primary"
              onClick={() => {
                setNotice(null);
                setDialog({ bench: null, open: true });
              }}
            >
              Add bench
            </Button>
          ) : undefined
        }
      />
      <BenchCautions />
      {notice && (
        <Alert tone="success" announce className="mb-4">
          {notice}
        </Alert>
      )}

      {benches.length === 0 ? (
        <EmptyState title="No benches yet">
          {canManage
            ? 'Add the lab’s test systems with Add bench; testers can then book time on them.'
            : 'An editor adds the lab’s test systems; you can book time on them once they are here.'}
        </EmptyState>
      ) : (
        <>
          <section aria-labelledby="benches-heading" className="mb-6">
            <h2 id="benches-heading" className="mb-2 text-lg font-semibold text-ink">
              Test systems
            </h2>
            <BenchesTable
              benches={benches}
              bookings={bookings}
              onEdit={canManage ? startEditing : undefined}
              now={openedAt}
            />
          </section>

          <div className="grid grid-cols-1 gap-5 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
            {bookableCells && (
              <div className="lg:sticky lg:top-4 lg:col-start-2 lg:row-start-1 lg:self-start">
                <Panel title="Book a bench" description="Your slot, for your assigned cells.">
                  <BookingForm
                    benches={benches}
                    cells={bookableCells}
                    initialBenchId={benchId}
                    suggestedStart={nextHour}
                    zoneLabel={zoneLabel}
                    onBooked={setLastBooking}
                  />
                  {lastBooking && lastBookingWeek !== dateParam(weekStart) && (
                    <p className="mt-3 text-sm">
                      <Link to={weekHref(new Date(lastBooking.startsAt))} className="underline underline-offset-2">
                        Show the week of {formatDayHeading(new Date(lastBooking.startsAt))}
                      </Link>
                    </p>
                  )}
                </Panel>
              </div>
            )}
            <div className={bookableCells ? 'lg:col-start-1 lg:row-start-1' : 'lg:col-span-2'}>
              <div className="mb-3 sm:w-72">
                <Select
                  label="Show bench"
                  required={false}
                  placeholder="All benches in service"
                  options={benches.map((bench) => ({
                    value: String(bench.id),
                    label: bench.active ? bench.name : `${bench.name} (out of service)`,
                  }))}
                  value={benchId === null ? '' : String(benchId)}
                  onChange={(event) =>
                    setParams(
                      (current) => {
                        const next = new URLSearchParams(current);
                        if (event.target.value) next.set('bench', event.target.value);
                        else next.delete('bench');
                        return next;
                      },
                      { preventScrollReset: true },
                    )
                  }
                />
              </div>
              <BookingAgenda
                weekStart={weekStart}
                today={today}
                benches={benches}
                bookings={bookings}
                benchId={benchId}
                currentUserId={currentUserId}
                weekHref={weekHref}
                zoneLabel={zoneLabel}
              />
            </div>
          </div>
        </>
      )}

      {canManage && (
        <BenchDialog
          open={dialog.open}
          bench={dialog.bench}
          profiles={profiles}
          onClose={() => setDialog((current) => ({ ...current, open: false }))}
          onSaved={(bench, created) => {
            setDialog((current) => ({ ...current, open: false }));
            setNotice(created ? `${bench.name} is added; testers can book it now.` : `${bench.name} is saved.`);
          }}
        />
      )}
    </>
  );
}
