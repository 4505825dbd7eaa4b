import { z } from 'zod';
import { Alert } from '../../../components/ui/alert';
import { Select } from '../../../components/ui/select';
import { useZodForm } from '../../../lib/use-zod-form';
import { whenValid } from '../../../../shared/schemas/checks';
import {
  createLoadConfigurationRequestSchema,
  fixedNeedsClock,
  loadSettingsModeLabels,
  type CreateLoadConfigurationRequest,
  loadSettingsModes,
  type LoadConfiguration,
} from '../../../../shared/schemas/load-configurations';
import { useCreateLoadConfiguration } from '../api/load-configurations';
import { numberFromText, optionalNumberFromText } from './form-numbers';
import { SetupFields, type SetupFieldSpec } from './setup-fields';
import { FormDialog, type CreateDialogProps } from '../../../components/ui/form-dialog';

const shape = createLoadConfigurationRequestSchema.shape;

/**
 * Text fields read into numbers, checked field by field with the shared schema's rules; the fixed-needs-a-clock
 * rule runs in the same pass as soon as its two fields are readable.
 */
const loadConfigurationFormSchema = z
  .object({
    ...shape,
    fixedClockMhz: optionalNumberFromText(z.number().int().min(100).max(10000)),
    expectedPackagePowerW: numberFromText(shape.expectedPackagePowerW),
    coreVoltageV: numberFromText(shape.coreVoltageV),
    soakMinutes: numberFromText(shape.soakMinutes),
  })
  .superRefine(fixedNeedsClock, { when: whenValid('settingsMode', 'fixedClockMhz') })
  // A clock typed before switching back to stock is not part of a stock configuration.
  .transform((value): CreateLoadConfigurationRequest =>
    value.settingsMode === 'stock' ? { ...value, fixedClockMhz: null } : value,
  )
  .pipe(createLoadConfigurationRequestSchema);

const emptyForm = {
  name: '',
  cpuDescription: '',
  settingsMode: 'stock',
  fixedClockMhz: '',
  settingsNotes: '',
  expectedPackagePowerW: '',
  coreVoltageV: '',
  soakMinutes: '',
};

const labels = {
  name: 'Configuration name',
  cpuDescription: 'CPU',
  settingsMode: 'Settings',
  fixedClockMhz: 'All-core clock (MHz)',
  settingsNotes: 'Further settings',
  expectedPackagePowerW: 'Expected package power (W)',
  coreVoltageV: 'Core voltage (V)',
  soakMinutes: 'Soak (minutes)',
};

const modeOptions = loadSettingsModes.map((mode) => ({ value: mode, label: loadSettingsModeLabels[mode] }));

type LoadConfigurationField = keyof typeof labels;

const whatFields: SetupFieldSpec<LoadConfigurationField>[] = [
  { name: 'name', placeholder: 'Stock all-core' },
  { name: 'cpuDescription', description: 'The CPU used, in words.' },
];

const clockFields: SetupFieldSpec<LoadConfigurationField>[] = [
  { name: 'fixedClockMhz', inputMode: 'numeric', placeholder: '5200' },
];

const loadFields = (fixed: boolean): SetupFieldSpec<LoadConfigurationField>[] => [
  { name: 'expectedPackagePowerW', inputMode: 'decimal', placeholder: '230.0' },
  {
    name: 'coreVoltageV',
    inputMode: 'decimal',
    placeholder: '1.250',
    description: fixed ? 'The voltage you set.' : 'The voltage expected under this load.',
  },
  { name: 'soakMinutes', inputMode: 'numeric', description: 'How long the load runs before readings count.' },
];

const notesFields: SetupFieldSpec<LoadConfigurationField>[] = [
  { name: 'settingsNotes', optional: true, description: 'Power limits, load-line calibration, the load program.' },
];

export type LoadConfigurationDialogProps = CreateDialogProps<LoadConfiguration>;

/** A new reusable load configuration: one CPU, one set of settings, the load it puts on the board. */
export function LoadConfigurationDialog({ open, onClose, onCreated }: LoadConfigurationDialogProps) {
  const create = useCreateLoadConfiguration();
  const form = useZodForm({
    schema: loadConfigurationFormSchema,
    initialValues: emptyForm,
    labels,
    messages: { settingsMode: 'Choose stock or fixed settings.' },
  });
  const fixed = form.values.settingsMode === 'fixed';

  return (
    <FormDialog
      open={open}
      onClose={onClose}
      size="lg"
      title="New load configuration"
      description="Saved for reuse; in this roundup it becomes one column of the test matrix."
      submitLabel="Save configuration"
      {...form.dialogSubmit(create, onCreated, 'The configuration was not saved')}
    >
      <div className="grid gap-4 sm:grid-cols-2">
        <SetupFields field={form.field} specs={whatFields} />
        <Select {...form.field('settingsMode')} options={modeOptions} />
        {fixed ? (
          <SetupFields field={form.field} specs={clockFields} />
        ) : (
          <div aria-hidden="true" className="hidden sm:block" />
        )}
        <SetupFields field={form.field} specs={loadFields(fixed)} />
      </div>
      <SetupFields field={form.field} specs={notesFields} />
      {fixed && (
        <Alert tone="caution">
          Fixed clocks and raised voltages can shorten component life and void warranties. Stay within the maker’s
          limits.
        </Alert>
      )}
    </FormDialog>
  );
}
