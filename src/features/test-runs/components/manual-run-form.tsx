import { useState, type FormEvent } from 'react';
import type { FieldErrors } from '../../../lib/form-errors';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Checkbox } from '../../../components/ui/checkbox';
import { describeSubmitError } from '../../../lib/form-errors';
import { useRecordManualRun } from '../api/test-runs-api';
import { CelsiusField } from './celsius-field';
import { emptyFacts, factsRequest, RunFactsFields } from './record-run';

/** A run entered by hand when no log exists: peak and ambient. Marked "Manual" everywhere it is shown. */
export function ManualRunForm({ cellId, onRecorded }: { cellId: number; onRecorded: (runId: number) => void }) {
  const [facts, setFacts] = useState(emptyFacts);
  const [peak, setPeak] = useState('');
  const [ambient, setAmbient] = useState('');
  const [throttled, setThrottled] = useState(false);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [askBookingReason, setAskBookingReason] = useState(false);
  const record = useRecordManualRun();

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const checked = factsRequest(facts);
    const found = { ...checked.errors };
    const peakC = Number(peak.trim());
    const ambientC = Number(ambient.trim());
    if (!peak.trim() || !Number.isFinite(peakC)) found.manualPeakC = 'Enter the peak in °C, such as 84.5.';
    if (!ambient.trim() || !Number.isFinite(ambientC)) found.manualAmbientC = 'Enter the ambient in °C, such as 21.0.';
    setErrors(found);
    setMessage(null);
    if (!checked.request || Object.keys(found).length > 0) return;
    record.mutate(
      { cellId, request: { ...checked.request, manualPeakC: peakC, manualAmbientC: ambientC, throttled } },
      {
        onSuccess: ({ run }) => onRecorded(run.id),
        onError: (error) => {
          const described = describeSubmitError(error);
          if (described.fields.outsideBookingReason) setAskBookingReason(true);
          setErrors(described.fields);
          setMessage(described.message);
        },
      },
    );
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-4" aria-label="Manual entry">
      <RunFactsFields
        idPrefix="manual-run"
        facts={facts}
        onChange={setFacts}
        errors={errors}
        askBookingReason={askBookingReason}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <CelsiusField
          id="manual-peak"
          label="Peak VRM temperature (°C)"
          value={peak}
          onValueChange={setPeak}
          error={errors.manualPeakC}
          required
        />
        <CelsiusField
          id="manual-ambient"
          label="Ambient (°C)"
          value={ambient}
          onValueChange={setAmbient}
          error={errors.manualAmbientC}
          required
        />
      </div>
      <Checkbox
        label="The board throttled"
        checked={throttled}
        onChange={(event) => setThrottled(event.target.checked)}
      />
      {message && (
        <Alert tone="danger" announce>
          {message}
        </Alert>
      )}
      <Button type="submit" variant="primary" pending={record.isPending}>
        Save the manual run
      </Button>
    </form>
  );
}
