import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import { useZodForm } from '../../../lib/use-zod-form';
import { formSchema } from '../../../lib/form-schema';
import { minorToMajorString, parseMajorAmount } from '../../../../shared/domain/planning/money';
import {
  sampleSourceLabels,
  sampleSources,
  sampleStatusLabels,
  sampleStatuses,
  updateSampleRequestSchema,
  type Sample,
  type SampleStatus,
  type UpdateSampleRequest,
} from '../../../../shared/schemas/samples';
import { useUpdateSample } from '../api/update-sample';
import { productDisplayName } from '../../../../shared/domain/planning/product-display-name';
import { FormDialog } from '../../../components/ui/form-dialog';

const labels = {
  source: 'Source',
  orderReference: 'Order reference',
  costMinor: 'Cost',
  costCurrency: 'Currency',
  vendorContact: 'Vendor contact',
  returnBy: 'Return by',
  status: 'Status',
  receivedOn: 'Received on',
  returnedOn: 'Returned on',
  serialNumber: 'Serial number',
  firmwareOnArrival: 'Firmware/BIOS on arrival',
  conditionNotes: 'Condition notes',
};
type FormValues = Record<keyof typeof labels, string>;

const sampleFormSchema = formSchema(updateSampleRequestSchema, (values: FormValues, flag): UpdateSampleRequest => {
  const source = values.source === 'retail' || values.source === 'vendor-loan' ? values.source : null;
  const currency = values.costCurrency.trim().toUpperCase();
  let costMinor: number | null = null;
  if (source === 'retail' && values.costMinor.trim()) {
    const parsed = parseMajorAmount(values.costMinor, /^[A-Z]{3}$/.test(currency) ? currency : 'EUR');
    if (!parsed.ok) flag('costMinor', parsed.message);
    else costMinor = parsed.amountMinor;
  }
  const date = (text: string) => text.trim() || null;
  return {
    source,
    // Only the chosen source's fields are sent; the other source's are cleared.
    orderReference: source === 'retail' ? values.orderReference : null,
    costMinor,
    costCurrency: source === 'retail' && (costMinor !== null || values.costMinor.trim()) ? currency : null,
    vendorContact: source === 'vendor-loan' ? values.vendorContact : null,
    returnBy: source === 'vendor-loan' ? date(values.returnBy) : null,
    receivedOn: date(values.receivedOn),
    returnedOn: date(values.returnedOn),
    serialNumber: values.serialNumber,
    conditionNotes: values.conditionNotes,
    firmwareOnArrival: values.firmwareOnArrival,
    status: values.status as SampleStatus,
  };
});

function valuesOf(sample: Sample, defaultCurrency: string): FormValues {
  return {
    source: sample.source ?? '',
    orderReference: sample.orderReference ?? '',
    costMinor: sample.cost ? minorToMajorString(sample.cost.amountMinor, sample.cost.currency) : '',
    costCurrency: sample.cost?.currency ?? defaultCurrency,
    vendorContact: sample.vendorContact ?? '',
    returnBy: sample.returnBy ?? '',
    status: sample.status,
    receivedOn: sample.receivedOn ?? '',
    returnedOn: sample.returnedOn ?? '',
    serialNumber: sample.serialNumber ?? '',
    firmwareOnArrival: sample.firmwareOnArrival ?? '',
    conditionNotes: sample.conditionNotes ?? '',
  };
}

const sourceOptions = sampleSources.map((source) => ({ value: source, label: sampleSourceLabels[source] }));
const statusOptions = sampleStatuses.map((status) => ({ value: status, label: sampleStatusLabels[status] }));

export interface SampleDialogProps {
  open: boolean;
  roundupId: number;
  sample: Sample;
  timeZone: string;
  /** The roundup band's currency, offered for a retail cost. */
  defaultCurrency: string;
  onClose: () => void;
  onSaved: (sample: Sample) => void;
}

/** One sample record: where the board came from, when it arrived, what it arrived with, where it is now. */
export function SampleDialog({
  open,
  roundupId,
  sample,
  timeZone,
  defaultCurrency,
  onClose,
  onSaved,
}: SampleDialogProps) {
  const update = useUpdateSample();
  const form = useZodForm({
    schema: sampleFormSchema,
    initialValues: valuesOf(sample, defaultCurrency),
    labels,
  });
  const source = form.values.source;

  const submit = () => {
    const changes = form.validate();
    if (!changes) return;
    update.mutate(
      { roundupId, sampleId: sample.id, changes },
      { onSuccess: onSaved, onError: (error) => form.fail(error) },
    );
  };

  return (
    <FormDialog
      open={open}
      onClose={onClose}
      size="lg"
      title={`Sample: ${productDisplayName(sample.product)}`}
      description={`Dates are calendar days in ${timeZone}.`}
      submitLabel="Save sample"
      pending={update.isPending}
      onSubmit={submit}
      problems={form.problems('The sample was not saved')}
    >
      <div className="grid gap-4 sm:grid-cols-2">
        <Select {...form.field('source')} options={sourceOptions} placeholder="Not known yet" optional />
        <Select {...form.field('status')} options={statusOptions} />
      </div>
      {source === 'retail' && (
        <div className="grid gap-4 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)_minmax(0,1fr)]">
          <TextField {...form.field('orderReference')} autoComplete="off" />
          <TextField {...form.field('costMinor')} inputMode="decimal" autoComplete="off" placeholder="189.99" />
          <TextField {...form.field('costCurrency')} autoComplete="off" maxLength={3} inputClassName="uppercase" />
        </div>
      )}
      {source === 'vendor-loan' && (
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField
            {...form.field('vendorContact')}
            autoComplete="off"
            description="Who lent it: name, e-mail or phone."
          />
          <TextField
            {...form.field('returnBy')}
            type="date"
            description={`Overdue once this day has ended in ${timeZone}.`}
          />
        </div>
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField {...form.field('receivedOn')} type="date" optional />
        <TextField
          {...form.field('returnedOn')}
          type="date"
          optional
          description="Only for a loan that has gone back."
        />
        <TextField {...form.field('serialNumber')} optional autoComplete="off" />
        <TextField {...form.field('firmwareOnArrival')} optional autoComplete="off" placeholder="1.02" />
      </div>
      <TextField
        {...form.field('conditionNotes')}
        optional
        autoComplete="off"
        description="Box, accessories, marks, bent pins — anything worth knowing before it goes on the bench."
      />
    </FormDialog>
  );
}
