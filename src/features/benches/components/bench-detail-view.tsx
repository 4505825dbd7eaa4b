import { useState } from 'react';
import { z } from 'zod';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { Panel } from '../../../components/ui/panel';
import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import { formatCalendarDate } from '../../../lib/format-time';
import { useZodForm } from '../../../lib/use-zod-form';
import {
  createInstrumentRequestSchema,
  createMaintenanceRequestSchema,
  instrumentKindLabels,
  instrumentKinds,
  type BenchDetail,
  type Instrument,
} from '../../../../shared/schemas/bench-detail';
import { useAddInstrument, useLogMaintenance, useUpdateInstrument } from '../api/bench-detail';

export interface BenchDetailViewProps {
  detail: BenchDetail;
  /** Editors add probes and loggers and record calibrations. */
  canManage: boolean;
  /** Editors and testers log maintenance. */
  canLog: boolean;
  /** Today as YYYY-MM-DD, from the loader (keeps rendering pure). */
  today: string;
}

/** A bench's hardware, its probes and logger with their calibration, and its maintenance log. */
export function BenchDetailView({ detail, canManage, canLog, today }: BenchDetailViewProps) {
  const { bench, setUp, instruments, maintenance } = detail;
  const overdue = instruments.filter((instrument) => instrument.calibrationOverdue);
  return (
    <div className="space-y-5">
      {overdue.length > 0 && (
        <Alert tone="warning" title="Calibration past due">
          {overdue.map((instrument) => instrument.label).join(', ')} {overdue.length === 1 ? 'is' : 'are'} past{' '}
          {overdue.length === 1 ? 'its' : 'their'} calibration date or was never calibrated. Readings from{' '}
          {overdue.length === 1 ? 'it' : 'them'} need a check before they are published.
        </Alert>
      )}
      <div className="grid grid-cols-1 gap-5 lg:grid-cols-2">
        <Panel title="Hardware" description={setUp ? `Built to the profile ${setUp.name}.` : undefined}>
          {setUp ? (
            <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1.5 text-sm">
              {[
                ['Case and fans', setUp.caseAndFans],
                ['CPU cooler', setUp.cooler],
                ['Power supply', setUp.psu],
                ['Memory', setUp.memory],
                [
                  'Room',
                  `${setUp.roomTempTargetC.toFixed(1)}\u2009°C ± ${setUp.roomTempToleranceC.toFixed(1)}\u2009°C`,
                ],
                ['Probe type', setUp.probeType],
                ['Probe placement', setUp.probePlacement],
              ].map(([term, value]) => (
                <div key={term} className="contents">
                  <dt className="text-muted">{term}</dt>
                  <dd>{value}</dd>
                </div>
              ))}
            </dl>
          ) : (
            <p className="text-sm text-muted">
              Built to no bench profile, so its set-up is not described. An editor can choose one on the Benches page.
            </p>
          )}
          {bench.notes && <p className="mt-3 text-sm">{bench.notes}</p>}
        </Panel>

        <Panel title="Probes and logger">
          {instruments.length === 0 ? (
            <p className="text-sm text-muted">No probes or logger recorded for this bench yet.</p>
          ) : (
            <ul aria-label="Probes and logger" className="divide-y divide-rule">
              {instruments.map((instrument) => (
                <InstrumentLine
                  key={instrument.id}
                  benchId={bench.id}
                  instrument={instrument}
                  canManage={canManage}
                  today={today}
                />
              ))}
            </ul>
          )}
          {canManage && <AddInstrumentForm benchId={bench.id} />}
        </Panel>
      </div>

      <Panel title="Maintenance log" description="What was done to this bench, newest first.">
        {canLog && <MaintenanceForm benchId={bench.id} today={today} />}
        {maintenance.length === 0 ? (
          <p className="text-sm text-muted">Nothing logged yet.</p>
        ) : (
          <ol aria-label="Maintenance log" className="mt-3 divide-y divide-rule">
            {maintenance.map((entry) => (
              <li key={entry.id} className="flex flex-wrap gap-x-4 gap-y-0.5 py-2 text-sm">
                <span className="numeric w-28 shrink-0">{formatCalendarDate(entry.doneOn)}</span>
                <span className="min-w-0 flex-1">{entry.description}</span>
                <span className="text-muted">{entry.recordedBy?.displayName ?? 'Former staff member'}</span>
              </li>
            ))}
          </ol>
        )}
      </Panel>
    </div>
  );
}

function InstrumentLine({
  benchId,
  instrument,
  canManage,
  today,
}: {
  benchId: number;
  instrument: Instrument;
  canManage: boolean;
  today: string;
}) {
  const update = useUpdateInstrument();
  const [error, setError] = useState<string | null>(null);
  return (
    <li className="flex flex-wrap items-start gap-x-4 gap-y-1 py-2 text-sm">
      <div className="min-w-0 flex-1 basis-48">
        <p className="font-semibold">
          {instrument.label} <span className="font-normal text-muted">· {instrumentKindLabels[instrument.kind]}</span>
        </p>
        <p className="text-[0.8125rem] text-muted">
          {[instrument.model, instrument.serialNumber && `serial ${instrument.serialNumber}`]
            .filter(Boolean)
            .join(', ')}
        </p>
      </div>
      <div className="text-[0.8125rem]">
        <p>Calibrated: {instrument.calibratedOn ? formatCalendarDate(instrument.calibratedOn) : 'never'}</p>
        <p>
          Next due: {instrument.nextCalibrationDue ? formatCalendarDate(instrument.nextCalibrationDue) : '—'}{' '}
          {instrument.calibrationOverdue && <Badge tone="negative">Past due</Badge>}
        </p>
        {error && <p className="text-red">{error}</p>}
      </div>
      {canManage && (
        <Button
          size="sm"
          pending={update.isPending}
          aria-label={`Calibrated today: ${instrument.label}`}
          onClick={() =>
            update.mutate(
              { benchId, instrumentId: instrument.id, changes: { calibratedOn: today } },
              { onSuccess: () => setError(null), onError: (failure) => setError(failure.message) },
            )
          }
        >
          Calibrated today
        </Button>
      )}
    </li>
  );
}

const instrumentForm = z
  .object({
    kind: z.string(),
    label: z.string(),
    model: z.string(),
    serialNumber: z.string(),
    calibratedOn: z.string(),
    calibrationIntervalMonths: z.string(),
  })
  .transform((values): z.input<typeof createInstrumentRequestSchema> => ({
    kind: values.kind as z.input<typeof createInstrumentRequestSchema>['kind'],
    label: values.label,
    model: values.model,
    serialNumber: values.serialNumber,
    calibratedOn: values.calibratedOn || null,
    // An empty field is not zero months: NaN makes the schema say what to enter.
    calibrationIntervalMonths: values.calibrationIntervalMonths.trim()
      ? Number(values.calibrationIntervalMonths)
      : Number.NaN,
  }))
  .pipe(createInstrumentRequestSchema);

function AddInstrumentForm({ benchId }: { benchId: number }) {
  const add = useAddInstrument();
  const [added, setAdded] = useState<string | null>(null);
  const form = useZodForm({
    schema: instrumentForm,
    initialValues: {
      kind: 'probe',
      label: '',
      model: '',
      serialNumber: '',
      calibratedOn: '',
      calibrationIntervalMonths: '12',
    },
    labels: {
      kind: 'Kind',
      label: 'Name',
      model: 'Type or model',
      serialNumber: 'Serial number',
      calibratedOn: 'Last calibrated',
      calibrationIntervalMonths: 'Months between calibrations',
    },
  });
  const submit = form.handleSubmit(
    (instrument) =>
      add.mutate(
        { benchId, instrument },
        {
          onSuccess: (saved) => {
            setAdded(`${saved.label} is added.`);
            form.reset();
          },
          onError: form.fail,
        },
      ),
    () => setAdded(null),
  );
  return (
    <form
      noValidate
      onSubmit={submit}
      aria-label="Add a probe or logger"
      className="mt-4 space-y-3 border-t border-rule pt-3"
    >
      <h3 className="text-sm font-semibold">Add a probe or logger</h3>
      {added && (
        <Alert tone="success" announce>
          {added}
        </Alert>
      )}
      <FormErrorSummary {...form.problems('Not added')} />
      <div className="grid grid-cols-[repeat(auto-fit,minmax(12rem,1fr))] gap-3">
        <Select
          {...form.field('kind')}
          options={instrumentKinds.map((kind) => ({ value: kind, label: instrumentKindLabels[kind] }))}
        />
        <TextField {...form.field('label')} autoComplete="off" />
        <TextField {...form.field('model')} optional autoComplete="off" />
        <TextField {...form.field('serialNumber')} optional autoComplete="off" />
        <TextField {...form.field('calibratedOn')} optional type="date" />
        <TextField {...form.field('calibrationIntervalMonths')} inputMode="numeric" />
      </div>
      <Button type="submit" pending={add.isPending}>
        Add
      </Button>
    </form>
  );
}

function MaintenanceForm({ benchId, today }: { benchId: number; today: string }) {
  const log = useLogMaintenance();
  const form = useZodForm({
    schema: createMaintenanceRequestSchema,
    initialValues: { doneOn: today, description: '' },
    labels: { doneOn: 'Done on', description: 'What was done' },
  });
  const submit = form.handleSubmit((entry) =>
    log.mutate({ benchId, entry }, { onSuccess: () => form.reset(), onError: form.fail }),
  );
  return (
    <form noValidate onSubmit={submit} aria-label="Log maintenance" className="space-y-3">
      <FormErrorSummary {...form.problems('Not logged')} />
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-[12rem_1fr]">
        <TextField {...form.field('doneOn')} type="date" max={today} />
        <TextField {...form.field('description')} autoComplete="off" maxLength={500} />
      </div>
      <Button type="submit" pending={log.isPending}>
        Log it
      </Button>
    </form>
  );
}
