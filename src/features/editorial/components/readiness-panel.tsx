import { useState } from 'react';
import { Link } from 'react-router';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { TextArea } from '../../../components/ui/text-area';
import { describeSubmitError } from '../../../lib/form-errors';
import { useZodForm } from '../../../lib/use-zod-form';
import type { Readiness } from '../../../../shared/schemas/readiness';
import { excludeCellRequestSchema } from '../../../../shared/schemas/readiness';

const kindLabels: Record<string, string> = {
  state: 'Roundup',
  section: 'Write-up',
  chart: 'Charts',
  verdict: 'Verdicts',
  cell: 'Matrix',
};

function CellExclusion({
  cellId,
  onExclude,
}: {
  cellId: number;
  onExclude: (cellId: number, reason: string) => Promise<unknown>;
}) {
  const [open, setOpen] = useState(false);
  const [pending, setPending] = useState(false);
  const form = useZodForm({
    schema: excludeCellRequestSchema,
    initialValues: { reason: '' },
    labels: { reason: 'Why this cell is left out' },
  });
  if (!open) {
    return (
      <Button size="sm" variant="quiet" onClick={() => setOpen(true)}>
        Leave this cell out…
      </Button>
    );
  }
  return (
    <form
      noValidate
      className="mt-2 space-y-2"
      onSubmit={form.handleSubmit(async ({ reason }) => {
        setPending(true);
        try {
          await onExclude(cellId, reason);
        } catch (failure) {
          form.fail(failure);
        } finally {
          setPending(false);
        }
      })}
    >
      {/* A refusal that names no field is still about the reason: it shows beside it. */}
      <TextArea {...form.field('reason')} error={form.errors.reason ?? form.formError} rows={2} maxLength={1000} />
      <div className="flex gap-2">
        <Button size="sm" type="submit" variant="danger" pending={pending}>
          Leave out
        </Button>
        <Button size="sm" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** What still keeps a roundup from being ready to schedule, each item linking to where it is fixed. */
export function ReadinessPanel({
  readiness,
  canExclude,
  onExclude,
  onInclude,
}: {
  readiness: Readiness;
  canExclude: boolean;
  onExclude: (cellId: number, reason: string) => Promise<unknown>;
  onInclude: (cellId: number) => Promise<unknown>;
}) {
  const [includeError, setIncludeError] = useState<string>();
  return (
    <div className="space-y-5">
      {readiness.ready ? (
        <Alert tone="success" title="Ready to schedule" announce>
          Every write-up section is signed off, every chart is approved and current, every tested product has its
          verdict label, and every matrix cell has an accepted run of record or was left out with a reason.
        </Alert>
      ) : (
        <section aria-labelledby="blocking-heading" className="rounded-[3px] border border-rule bg-surface">
          <h2 id="blocking-heading" className="border-b border-rule px-4 py-3 text-base font-semibold text-ink">
            Not ready to schedule: {readiness.blocking.length} thing{readiness.blocking.length === 1 ? '' : 's'} still
            blocking
          </h2>
          <ul className="divide-y divide-rule">
            {readiness.blocking.map((item) => (
              <li key={`${item.kind}-${item.label}`} className="px-4 py-2.5 text-sm">
                <span className="mr-2 font-mono text-xs tracking-wide text-muted uppercase">
                  {kindLabels[item.kind] ?? item.kind}
                </span>
                <Link to={item.link} className="text-ink underline decoration-copper underline-offset-2">
                  {item.label}
                </Link>
                {canExclude && item.cellId !== undefined && (
                  <CellExclusion cellId={item.cellId} onExclude={onExclude} />
                )}
              </li>
            ))}
          </ul>
        </section>
      )}
      {readiness.excludedCells.length > 0 && (
        <section aria-labelledby="excluded-heading" className="rounded-[3px] border border-rule bg-surface">
          <h2 id="excluded-heading" className="border-b border-rule px-4 py-3 text-base font-semibold text-ink">
            Cells left out of the roundup
          </h2>
          <ul className="divide-y divide-rule">
            {readiness.excludedCells.map((cell) => (
              <li key={cell.cellId} className="flex flex-wrap items-start justify-between gap-2 px-4 py-2.5 text-sm">
                <span>
                  <span className="text-ink">{cell.label}</span>
                  <span className="block text-muted">{cell.reason}</span>
                </span>
                {canExclude && (
                  <Button
                    size="sm"
                    onClick={async () => {
                      setIncludeError(undefined);
                      try {
                        await onInclude(cell.cellId);
                      } catch (failure) {
                        setIncludeError(describeSubmitError(failure).message);
                      }
                    }}
                  >
                    Take back in
                  </Button>
                )}
              </li>
            ))}
          </ul>
          {includeError && (
            <Alert tone="danger" announce className="m-4">
              {includeError}
            </Alert>
          )}
        </section>
      )}
    </div>
  );
}
