import { useRef, useState, type FormEvent } from 'react';
import type { FieldErrors } from '../../../lib/form-errors';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Panel } from '../../../components/ui/panel';
import { TextArea } from '../../../components/ui/text-area';
import { TextField } from '../../../components/ui/text-field';
import { UploadProgress } from '../../../components/ui/upload-progress';
import { isApiError } from '../../../lib/api-client';
import { isUploadCancelled, type UploadProgress as Progress } from '../../../lib/upload';
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
  const set = (name: keyof RunFactsDraft) => (event: { target: { value: string } }) =>
    onChange({ ...facts, [name]: event.target.value });
  return (
    <>
      <TextField
        id={`${idPrefix}-firmware`}
        label="Firmware (BIOS) version"
        value={facts.firmwareVersion}
        onChange={set('firmwareVersion')}
        error={errors.firmwareVersion}
        required
      />
      <TextField
        id={`${idPrefix}-started`}
        type="datetime-local"
        label="Soak started"
        description={zoneSentence()}
        value={facts.startedAt}
        onChange={set('startedAt')}
        error={errors.startedAt}
        required
      />
      <TextArea
        id={`${idPrefix}-notes`}
        label="Notes"
        optional
        value={facts.notes}
        onChange={set('notes')}
        error={errors.notes}
      />
      {askBookingReason && (
        <TextArea
          id={`${idPrefix}-outside-booking`}
          label="Why this run is outside your bookings"
          value={facts.outsideBookingReason}
          onChange={set('outsideBookingReason')}
          error={errors.outsideBookingReason}
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
  const [facts, setFacts] = useState(emptyFacts);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [askBookingReason, setAskBookingReason] = useState(false);
  const [progress, setProgress] = useState<Progress | null>(null);
  const controller = useRef<AbortController | null>(null);
  const record = useRecordLoggerRun();

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (!file || !result) return;
    const checked = factsRequest(facts);
    setErrors(checked.errors);
    setMessage(null);
    if (!checked.request) return;
    const analysed = JSON.parse(result.requestJson) as AnalysisRequestInput;
    if (!analysed.mapping) return;
    const { mapping } = analysed;
    controller.current = new AbortController();
    record.mutate(
      {
        cellId,
        file,
        request: { ...checked.request, mapping, options: analysed.options, rememberMapping: true },
        onProgress: setProgress,
        signal: controller.current.signal,
      },
      {
        onSuccess: ({ run }) => onRecorded(run.id),
        onError: (failure: unknown) => {
          const error = failure;
          if (isUploadCancelled(error)) return;
          if (isApiError(error)) {
            if (error.code === 'outside_booking') setAskBookingReason(true);
            setErrors(error.fields);
            setMessage(error.message);
          } else setMessage('Something went wrong. Try again.');
        },
        onSettled: () => setProgress(null),
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
            <RunFactsFields
              idPrefix="logger-run"
              facts={facts}
              onChange={setFacts}
              errors={errors}
              askBookingReason={askBookingReason}
            />
            {message && (
              <Alert tone="danger" announce>
                {message}
              </Alert>
            )}
            {progress && (
              <UploadProgress
                progress={progress}
                label="Submitting the run"
                processingText="Uploaded. The server is storing and analysing the log…"
                onCancel={() => controller.current?.abort()}
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
