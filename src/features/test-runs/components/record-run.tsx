import { useState, type FormEvent } from 'react';
import { describeSubmitError, type FieldErrors } from '../../../lib/form-errors';
import { AnnouncedAlert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Panel } from '../../../components/ui/panel';
import { TextArea } from '../../../components/ui/text-area';
import { TextField } from '../../../components/ui/text-field';
import { draftField } from '../../../components/ui/draft-field';
import { UploadProgress, useCancellableUpload } from '../../../components/ui/upload-progress';
import { isUploadCancelled } from '../../../lib/upload';
import type { AnalysisRequestInput, ColumnMapping } from '../../../../shared/schemas/analysis';
import { LogCheckSteps } from '../../log-check/components/log-check-steps';
import { LogFilePanel } from '../../log-check/components/log-file-panel';
import { useAppliedMapping } from '../../log-check/components/use-applied-mapping';
import { useLogCheck } from '../../log-check/components/use-log-check';
import { useRecordLoggerRun } from '../api/test-runs-api';
import { instantFromLocal, localNow, optionalText, zoneSentence } from './run-facts';

export interface RunFactsDraft {
  firmwareVersion: string;
  startedAt: string;
  notes: string;
  outsideBookingReason: string;
}

export const emptyFacts = (): RunFactsDraft => ({
  firmwareVersion: '',
  startedAt: localNow(),
  notes: '',
  outsideBookingReason: '',
});

/** The facts every run records besides its data; the booking reason appears once the server asks for it. */
export function RunFactsFields({
  idPrefix,
  facts,
  onChange,
  errors,
  askBookingReason,
}: {
  idPrefix: string;
  facts: RunFactsDraft;
  onChange: (facts: RunFactsDraft) => void;
  errors: FieldErrors;
  askBookingReason: boolean;
}) {
  const field = draftField(facts, onChange, errors);
  return (
    <>
      <TextField id={`${idPrefix}-firmware`} label="Firmware (BIOS) version" {...field('firmwareVersion')} required />
      <TextField
        id={`${idPrefix}-started`}
        type="datetime-local"
        label="Soak started"
        description={zoneSentence()}
        {...field('startedAt')}
        required
      />
      <TextArea id={`${idPrefix}-notes`} label="Notes" optional {...field('notes')} />
      {askBookingReason && (
        <TextArea
          id={`${idPrefix}-outside-booking`}
          label="Why this run is outside your bookings"
          {...field('outsideBookingReason')}
        />
      )}
    </>
  );
}

/** Checks the facts on the client; the server checks them again. */
export function factsRequest(facts: RunFactsDraft) {
  const errors: FieldErrors = {};
  if (!facts.firmwareVersion.trim()) errors.firmwareVersion = 'Enter the firmware (BIOS) version the board ran.';
  const startedAt = instantFromLocal(facts.startedAt);
  if (!startedAt) errors.startedAt = 'Enter the date and time the soak started.';
  if (Object.keys(errors).length > 0 || !startedAt) return { errors, request: null };
  return {
    errors,
    request: {
      firmwareVersion: facts.firmwareVersion.trim(),
      startedAt,
      notes: optionalText(facts.notes),
      outsideBookingReason: optionalText(facts.outsideBookingReason),
    },
  };
}

/**
 * A run form's facts as typed, their problems and the form's message; once the server asks why a run is outside the
 * bookings, the reason field appears and stays.
 */
export function useRunFacts() {
  const [facts, setFacts] = useState(emptyFacts);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [askBookingReason, setAskBookingReason] = useState(false);

  /** Checks the facts (with the form's own problems, `more`); the request when nothing is wrong, else null. */
  const check = (more: FieldErrors = {}) => {
    const checked = factsRequest(facts);
    const found = { ...checked.errors, ...more };
    setErrors(found);
    setMessage(null);
    return Object.keys(found).length > 0 ? null : checked.request;
  };

  /** Shows a refused request: problems beside their fields, the server's message under the form. */
  const fail = (error: unknown) => {
    const described = describeSubmitError(error);
    if (described.fields.outsideBookingReason) setAskBookingReason(true);
    setErrors(described.fields);
    setMessage(described.message);
  };

  return { check, fail, message, errors, fields: { facts, onChange: setFacts, errors, askBookingReason } };
}

export interface RecordLoggerRunProps {
  cellId: number;
  rememberedMapping: ColumnMapping | null;
  signInPath: string;
  onRecorded: (runId: number) => void;
}

/**
 * Record a run from a logger file: choose the file, see how it reads (the bench profile's remembered mapping applied),
 * confirm the mapping and see the analysis and chart, then give the run's facts and send the same file.
 */
export function RecordLoggerRun({ cellId, rememberedMapping, signInPath, onRecorded }: RecordLoggerRunProps) {
  const check = useLogCheck();
  const { file, result } = check;
  const remembered = useAppliedMapping(check, rememberedMapping);
  const run = useRunFacts();
  const sender = useCancellableUpload();
  const record = useRecordLoggerRun();

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (!file || !result) return;
    const facts = run.check();
    if (!facts) return;
    const analysed = JSON.parse(result.requestJson) as AnalysisRequestInput;
    if (!analysed.mapping) return;
    const { mapping } = analysed;
    record.mutate(
      {
        cellId,
        file,
        request: { ...facts, mapping, options: analysed.options, rememberMapping: true },
        ...sender.start(),
      },
      {
        onSuccess: ({ run }) => onRecorded(run.id),
        onError: (failure: unknown) => {
          if (!isUploadCancelled(failure)) run.fail(failure);
        },
        onSettled: sender.settled,
      },
    );
  };

  return (
    <div className="space-y-6">
      <LogFilePanel check={check} signInPath={signInPath} kept />
      <LogCheckSteps
        check={check}
        headingLevel={3}
        filledFrom={
          remembered ? 'Mapping remembered from this bench profile’s last run. Check it, then press Analyse.' : null
        }
      />
      {file && result && !check.resultOutdated && (
        <Panel
          title="3 · The run"
          description="What the board ran and when; the file above is stored with the run as evidence."
        >
          <form noValidate onSubmit={submit} className="space-y-4" aria-label="Run details">
            <RunFactsFields idPrefix="logger-run" {...run.fields} />
            <AnnouncedAlert tone="danger" message={run.message} />
            {sender.shown && (
              <UploadProgress
                {...sender.shown}
                label="Submitting the run"
                processingText="Uploaded. The server is storing and analysing the log…"
              />
            )}
            <Button type="submit" variant="primary" pending={record.isPending}>
              Submit the run
            </Button>
          </form>
        </Panel>
      )}
    </div>
  );
}
