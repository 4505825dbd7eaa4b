import { z } from 'zod';
import { useZodForm } from '../../../lib/use-zod-form';
import { createBenchProfileRequestSchema, type BenchProfile } from '../../../../shared/schemas/bench-profiles';
import { useCreateBenchProfile } from '../api/bench-profiles';
import { numberFromText } from './form-numbers';
import { SetupFields, type SetupFieldSpec } from './setup-fields';
import { FormDialog, type CreateDialogProps } from '../../../components/ui/form-dialog';

const shape = createBenchProfileRequestSchema.shape;

/** The shared request schema, with the numbers read from text fields. */
const benchProfileFormSchema = z.object({
  ...shape,
  roomTempTargetC: numberFromText(shape.roomTempTargetC),
  roomTempToleranceC: numberFromText(shape.roomTempToleranceC),
  requiredSoakMinutes: numberFromText(shape.requiredSoakMinutes),
});

const emptyForm = {
  name: '',
  caseAndFans: '',
  cooler: '',
  psu: '',
  memory: '',
  roomTempTargetC: '',
  roomTempToleranceC: '',
  probeType: '',
  probePlacement: '',
  requiredSoakMinutes: '',
  notes: '',
};

const labels = {
  name: 'Profile name',
  caseAndFans: 'Case and fans',
  cooler: 'CPU cooler',
  psu: 'Power supply',
  memory: 'Memory and its settings',
  roomTempTargetC: 'Room temperature target (°C)',
  roomTempToleranceC: 'Room temperature tolerance (± °C)',
  probeType: 'Probe type',
  probePlacement: 'Probe placement',
  requiredSoakMinutes: 'Required soak (minutes)',
  notes: 'Notes',
};

type BenchProfileField = keyof typeof labels;

const nameField: SetupFieldSpec<BenchProfileField>[] = [{ name: 'name', placeholder: 'Open bench, 360 mm loop' }];

const setupFields: SetupFieldSpec<BenchProfileField>[] = [
  { name: 'caseAndFans', description: 'Case or open bench, fans and their speeds.' },
  { name: 'cooler' },
  { name: 'psu' },
  { name: 'memory', description: 'Kit, speed, timings, voltage.' },
  { name: 'roomTempTargetC', inputMode: 'decimal', placeholder: '21.0' },
  { name: 'roomTempToleranceC', inputMode: 'decimal', placeholder: '1.0' },
  { name: 'probeType', placeholder: 'Type K thermocouple, 0.1 mm bead' },
  { name: 'requiredSoakMinutes', inputMode: 'numeric', description: 'Readings count only after this long under load.' },
];

const placementFields: SetupFieldSpec<BenchProfileField>[] = [
  { name: 'probePlacement', description: 'Where the probes go, e.g. board rear under the V-core stages, taped.' },
  { name: 'notes', optional: true },
];

export type BenchProfileDialogProps = CreateDialogProps<BenchProfile>;

/** A new reusable bench profile: the test system and the room every result of a roundup comes from. */
export function BenchProfileDialog({ open, onClose, onCreated }: BenchProfileDialogProps) {
  const create = useCreateBenchProfile();
  const form = useZodForm({ schema: benchProfileFormSchema, initialValues: emptyForm, labels });

  return (
    <FormDialog
      open={open}
      onClose={onClose}
      size="lg"
      title="New bench profile"
      description="Saved for reuse: later roundups can pick the same test system."
      submitLabel="Save profile"
      {...form.dialogSubmit(create, onCreated, 'The profile was not saved')}
    >
      <SetupFields field={form.field} specs={nameField} />
      <div className="grid gap-4 sm:grid-cols-2">
        <SetupFields field={form.field} specs={setupFields} />
      </div>
      <SetupFields field={form.field} specs={placementFields} />
    </FormDialog>
  );
}
