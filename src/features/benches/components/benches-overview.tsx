import { useState, type ReactNode } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';
import type { Bench, Booking } from '../../../../shared/schemas/benches';
import { useBenches } from '../api/get-benches';
import { BenchDialog, type BenchProfileOption } from './bench-dialog';
import { BenchesTable } from './benches-table';

export interface BenchesOverviewProps {
  /** Editors add and edit benches. */
  canManage: boolean;
  /** Bench testers book time; the description says so. */
  canBook: boolean;
  /** Bench profiles for the bench form (editors only). */
  profiles: readonly BenchProfileOption[];
  /** This week's bookings, for each bench's next slot. */
  bookings: readonly Booking[];
  /** The moment the page was opened, from the loader (keeps rendering pure). */
  openedAt: number;
  /** The standing safety note, under the page heading. */
  caution: ReactNode;
  /** The booking calendar, under the benches. */
  children: ReactNode;
}

/** The Benches page around its calendar: the test systems, and for editors adding and editing them. */
export function BenchesOverview({
  canManage,
  canBook,
  profiles,
  bookings,
  openedAt,
  caution,
  children,
}: BenchesOverviewProps) {
  const benches = useBenches();
  const [dialog, setDialog] = useState<{ bench: Bench | null; open: boolean }>({ bench: null, open: false });
  const [notice, setNotice] = useState<string | null>(null);

  const openDialog = (bench: Bench | null) => {
    setNotice(null);
    setDialog({ bench, open: true });
  };

  return (
    <>
      <PageHeader
        eyebrow="Lab"
        title="Benches"
        description={
          canBook
            ? 'The physical test systems and who has them when. Book time against the cells assigned to you.'
            : 'The physical test systems and who has them when. Bench testers book time against their assigned cells.'
        }
        actions={
          canManage ? (
            <Button variant="primary" onClick={() => openDialog(null)}>
              Add bench
            </Button>
          ) : undefined
        }
      />
      {caution}
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
              onEdit={canManage ? openDialog : undefined}
              now={openedAt}
            />
          </section>
          {children}
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
