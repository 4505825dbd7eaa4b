import { useId, useState, type FormEvent } from 'react';
import { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { Checkbox } from '../../../components/ui/checkbox';
import { Dialog } from '../../../components/ui/dialog';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import { useZodForm } from '../../../lib/use-zod-form';
import { createBenchRequestSchema, type Bench } from '../../../../shared/schemas/benches';
import { useCreateBench, useUpdateBench } from '../api/save-bench';
import { TextArea } from '../../../components/ui/text-area';

/** The form's text values, read into the same request the server validates (the profile picker sends an id). */
const benchFormSchema = z
  .object({ name: z.string(), location: z.string(), benchProfileId: z.string(), notes: z.string() })
  .transform((values, ctx) => {
    const parsed = createBenchRequestSchema.safeParse({
      ...values,
      benchProfileId: values.benchProfileId ? Number(values.benchProfileId) : null,
    });
    if (!parsed.success) {
      for (const issue of parsed.error.issues)
        ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
      return z.NEVER;
    }
    return parsed.data;
  });

/** A bench profile a bench can be built to (archived ones are left out of the picker). */
export interface BenchProfileOption {
  id: number;
  name: string;
}

export interface BenchDialogProps {
  open: boolean;
  /** Null adds a bench. */
  bench: Bench | null;
  profiles: readonly BenchProfileOption[];
  onClose: () => void;
  onSaved: (bench: Bench, created: boolean) => void;
}

export function BenchDialog({ open, bench, profiles, onClose, onSaved }: BenchDialogProps) {
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title={bench ? `Edit ${bench.name}` : 'Add a bench'}
      description={bench ? undefined : 'A physical test system with its own booking calendar.'}
    >
      {/* Keyed, so each bench (or a new one) starts from its own values. */}
      <BenchForm key={bench?.id ?? 'new'} bench={bench} profiles={profiles} onClose={onClose} onSaved={onSaved} />
    </Dialog>
  );
}

function BenchForm({ bench, profiles, onClose, onSaved }: Omit<BenchDialogProps, 'open'>) {
  const formId = useId();
  const create = useCreateBench();
  const update = useUpdateBench();
  const [active, setActive] = useState(bench?.active ?? true);
  const form = useZodForm({
    schema: benchFormSchema,
    initialValues: {
      name: bench?.name ?? '',
      location: bench?.location ?? '',
      benchProfileId: bench?.benchProfile ? String(bench.benchProfile.id) : '',
      notes: bench?.notes ?? '',
    },
    labels: { name: 'Name', location: 'Location', benchProfileId: 'Built to profile', notes: 'Notes' },
  });
  const profileOptions = profiles.map((profile) => ({ value: String(profile.id), label: profile.name }));
  if (bench?.benchProfile && !profiles.some((profile) => profile.id === bench.benchProfile?.id)) {
    profileOptions.push({ value: String(bench.benchProfile.id), label: `${bench.benchProfile.name} (archived)` });
  }

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const input = form.validate();
    if (!input) return;
    if (bench) {
      update.mutate(
        { id: bench.id, changes: { ...input, active } },
        { onSuccess: (saved) => onSaved(saved, false), onError: (error) => form.fail(error) },
      );
    } else {
      create.mutate(input, {
        onSuccess: (saved) => {
          form.reset();
          onSaved(saved, true);
        },
        onError: (error) => form.fail(error),
      });
    }
  };

  return (
    <form id={formId} noValidate onSubmit={submit} className="space-y-4">
      <FormErrorSummary {...form.problems(bench ? 'The changes were not saved' : 'The bench was not added')} />
      <TextField {...form.field('name')} autoComplete="off" description="How testers know it, e.g. “Bench 2”." />
      <TextField {...form.field('location')} optional autoComplete="off" description="Room or corner of the lab." />
      <Select
        {...form.field('benchProfileId')}
        optional
        placeholder="None"
        options={profileOptions}
        description="The test system description this bench is set up to."
      />
      <TextArea
        {...form.field('notes')}
        onChange={(event) => form.setValue('notes', event.target.value)}
        optional
        rows={3}
        description="Quirks, missing parts, who to ask."
      />
      {bench && (
        <Checkbox
          label="In service"
          description="A bench out of service takes no new bookings; existing bookings stay."
          checked={active}
          onChange={(event) => setActive(event.target.checked)}
        />
      )}
      <div className="flex flex-wrap justify-end gap-2 border-t border-rule pt-3">
        <Button onClick={onClose}>Cancel</Button>
        <Button type="submit" variant="primary" pending={create.isPending || update.isPending}>
          {bench ? 'Save changes' : 'Add bench'}
        </Button>
      </div>
    </form>
  );
}
