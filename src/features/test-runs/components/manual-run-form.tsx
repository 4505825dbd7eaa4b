import { useState, type FormEvent } from 'react';
import type { FieldErrors } from '../../../lib/form-errors';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Checkbox } from '../../../components/ui/checkbox';
import { describeSubmitError } from '../../../lib/form-errors';
import { useRecordManualRun } from '../api/test-runs-api';
import { CelsiusFields, readCelsius, type CelsiusFieldSpec } from './celsius-field';
import { emptyFacts, factsRequest, RunFactsFields } from './record-run';

const manualFields: readonly CelsiusFieldSpec<'manualPeakC' | 'manualAmbientC'>[] = [
  {
    name: 'manualPeakC',
    id: 'manual-peak',
    label: 'Peak VRM temperature (°C)',
    invalid: 'Enter the peak in °C, such as 84.5.',
  },
  {
    name: 'manualAmbientC',
    id: 'manual-ambient',
    label: 'Ambient (°C)',
    invalid: 'Enter the ambient in °C, such as 21.0.',
  },
];

/** A run entered by hand when no log exists: peak and ambient. Marked "Manual" everywhere it is shown. */
export function ManualRunForm({ cellId, onRecorded }: { cellId: number; onRecorded: (runId: number) => void }) {
  const [facts, setFacts] = useState(emptyFacts);
  const [temperatures, setTemperatures] = useState({ manualPeakC: '', manualAmbientC: '' });
  const [throttled, setThrottled] = useState(false);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [askBookingReason, setAskBookingReason] = useState(false);
  const record = useRecordManualRun();

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const checked = factsRequest(facts);
    const measured = readCelsius(manualFields, temperatures);
    const found = { ...checked.errors, ...measured.errors };
    setErrors(found);
    setMessage(null);
    if (!checked.request || Object.keys(found).length > 0) return;
    record.mutate(
      { cellId, request: { ...checked.request, ...measured.values, throttled } },
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
        <CelsiusFields fields={manualFields} typed={temperatures} onChange={setTemperatures} errors={errors} required />
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
