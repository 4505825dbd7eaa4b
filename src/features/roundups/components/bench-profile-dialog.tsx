import { z } from 'zod';
import { TextField } from '../../../components/ui/text-field';
import { useZodForm } from '../../../lib/use-zod-form';
import { createBenchProfileRequestSchema, type BenchProfile } from '../../../../shared/schemas/bench-profiles';
import { useCreateBenchProfile } from '../api/create-bench-profile';
import { numberFromText } from './form-numbers';
import { FormDialog } from '../../../components/ui/form-dialog';

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

export interface BenchProfileDialogProps {
  open: boolean;
  onClose: () => void;
  onCreated: (profile: BenchProfile) => void;
}

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
      pending={create.isPending}
      onSubmit={() => form.submitWith(create, onCreated)}
      problems={form.problems('The profile was not saved')}
    >
      <TextField {...form.field('name')} autoComplete="off" placeholder="Open bench, 360 mm loop" />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          {...form.field('caseAndFans')}
          autoComplete="off"
          description="Case or open bench, fans and their speeds."
        />
        <TextField {...form.field('cooler')} autoComplete="off" />
        <TextField {...form.field('psu')} autoComplete="off" />
        <TextField {...form.field('memory')} autoComplete="off" description="Kit, speed, timings, voltage." />
        <TextField {...form.field('roomTempTargetC')} inputMode="decimal" autoComplete="off" placeholder="21.0" />
        <TextField {...form.field('roomTempToleranceC')} inputMode="decimal" autoComplete="off" placeholder="1.0" />
        <TextField {...form.field('probeType')} autoComplete="off" placeholder="Type K thermocouple, 0.1 mm bead" />
        <TextField
          {...form.field('requiredSoakMinutes')}
          inputMode="numeric"
          autoComplete="off"
          description="Readings count only after this long under load."
        />
      </div>
      <TextField
        {...form.field('probePlacement')}
        autoComplete="off"
        description="Where the probes go, e.g. board rear under the V-core stages, taped."
      />
      <TextField {...form.field('notes')} optional autoComplete="off" />
    </FormDialog>
  );
}
