import { useState, type FormEvent } from 'react';
import { AnnouncedAlert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Checkbox } from '../../../components/ui/checkbox';
import { useRecordManualRun } from '../api/test-runs-api';
import { CelsiusFields, readCelsius, type CelsiusFieldSpec } from './celsius-field';
import { RunFactsFields, useRunFacts } from './record-run';

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
  const run = useRunFacts();
  const [temperatures, setTemperatures] = useState({ manualPeakC: '', manualAmbientC: '' });
  const [throttled, setThrottled] = useState(false);
  const record = useRecordManualRun();

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const measured = readCelsius(manualFields, temperatures);
    const facts = run.check(measured.errors);
    if (!facts) return;
    record.mutate(
      { cellId, request: { ...facts, ...measured.values, throttled } },
      { onSuccess: (recorded) => onRecorded(recorded.run.id), onError: run.fail },
    );
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-4" aria-label="Manual entry">
      <RunFactsFields idPrefix="manual-run" {...run.fields} />
      <div className="grid gap-4 sm:grid-cols-2">
        <CelsiusFields
          fields={manualFields}
          typed={temperatures}
          onChange={setTemperatures}
          errors={run.errors}
          required
        />
      </div>
      <Checkbox
        label="The board throttled"
        checked={throttled}
        onChange={(event) => setThrottled(event.target.checked)}
      />
      <AnnouncedAlert tone="danger" message={run.message} />
      <Button type="submit" variant="primary" pending={record.isPending}>
        Save the manual run
      </Button>
    </form>
  );
}
