import { useEffect, useRef, useState, type ChangeEvent, type FormEvent, type ReactNode } from 'react';
import { Link, useBlocker } from 'react-router';
import { Button, buttonStyles } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { Select, type SelectOption } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import {
  effectivePhaseCount,
  phaseMultiplicationLabels,
  phaseMultiplications,
  vcoreRatedCurrentA,
  vcoreStageCount,
} from '../../../../shared/domain/planning/power-design';
import {
  commonLanSpeedsMbps,
  formFactorLabels,
  formFactors,
  frontUsbCHeaderLabels,
  frontUsbCHeaders,
  vcoreStageTypeLabels,
  vcoreStageTypes,
  wifiGenerationLabels,
  wifiGenerations,
  createProductRequestSchema,
  type ProductDetail,
  type ProductInput,
} from '../../../../shared/schemas/catalog';
import { formatAmps, formatLanSpeed } from './catalog-format';
import {
  productFieldLabels,
  productIssueMessage,
  productRequestFrom,
  readNumber,
  type ProductField,
  type ProductFormValues,
} from './product-form-values';
import { TextArea } from '../../../components/ui/text-area';
import { useZodForm } from '../../../lib/use-zod-form';

export interface ProductFormProps {
  initialValues: ProductFormValues;
  submitLabel: string;
  /** Where Cancel goes. */
  cancelTo: string;
  /** Sends the validated product; a rejection is shown on the form with everything typed kept. */
  save: (input: ProductInput) => Promise<ProductDetail>;
  onSaved: (product: ProductDetail) => void;
  errorTitle: string;
}

const options = <T extends string>(values: readonly T[], labels: Record<T, string>): SelectOption[] =>
  values.map((value) => ({ value, label: labels[value] }));

function lanOptions(current: string): SelectOption[] {
  const speeds: number[] = [...commonLanSpeedsMbps];
  const typed = readNumber(current, true);
  if (typeof typed === 'number' && !speeds.includes(typed)) speeds.push(typed);
  return speeds.sort((a, b) => a - b).map((speed) => ({ value: String(speed), label: formatLanSpeed(speed) }));
}

/**
 * How one field is typed: free text, a whole number, a count in a narrow numeric box, a decimal, a date, a short
 * note over two lines, or a choice from a list (which may depend on what is typed elsewhere).
 */
type ProductFieldSpec = {
  name: ProductField;
  description?: string;
  className?: string;
} & (
  | { kind: 'text' | 'integer' | 'count' | 'decimal' | 'date' | 'notes' }
  | { kind: 'choice'; options: (values: ProductFormValues) => SelectOption[] }
);

/** Everything else may stay empty while it is not known. */
const requiredFields = new Set<ProductField>(['maker', 'model', 'platform', 'socket', 'chipset', 'formFactor']);

const identityFields: ProductFieldSpec[] = [
  { name: 'maker', kind: 'text' },
  { name: 'model', kind: 'text' },
  { name: 'platform', kind: 'text', description: 'The CPU platform, e.g. Helix-1700.' },
  { name: 'socket', kind: 'text' },
  { name: 'chipset', kind: 'text' },
  { name: 'formFactor', kind: 'choice', options: () => options(formFactors, formFactorLabels) },
  { name: 'releaseDate', kind: 'date' },
];

const powerDesignFields: ProductFieldSpec[] = [
  { name: 'powerDesign.controller', kind: 'text', description: 'Its marking.' },
  { name: 'powerDesign.controllerPhases', kind: 'integer', description: 'Phases the controller drives, 1–32.' },
  {
    name: 'powerDesign.phaseMultiplication',
    kind: 'choice',
    options: () => options(phaseMultiplications, phaseMultiplicationLabels),
  },
  {
    name: 'powerDesign.stagesPerPhase',
    kind: 'integer',
    description: '1 for direct and doubled; 2 or more when teamed.',
  },
  { name: 'powerDesign.vcoreStageType', kind: 'choice', options: () => options(vcoreStageTypes, vcoreStageTypeLabels) },
  { name: 'powerDesign.vcoreStagePart', kind: 'text', description: 'As printed on the stage or MOSFET.' },
  {
    name: 'powerDesign.vcoreStageCurrentA',
    kind: 'decimal',
    description: 'Continuous current of one stage in A, e.g. 60 or 62.5.',
  },
  { name: 'powerDesign.socRailStages', kind: 'integer', description: 'Stages on the SoC rail.' },
];

const powerDesignNoteFields: ProductFieldSpec[] = [
  {
    name: 'powerDesign.otherRails',
    kind: 'notes',
    description: 'In words, e.g. “1 stage graphics, 1 stage auxiliary”.',
  },
  { name: 'powerDesign.heatsinkNotes', kind: 'notes', description: 'Fins, heat pipes, pads, contact with the stages.' },
];

const rearUsbFields: ProductFieldSpec[] = (['usb2', 'usb5g', 'usb10g', 'usb20g', 'usb40g'] as const).map((speed) => ({
  name: `features.rearUsb.${speed}`,
  kind: 'count',
}));

const featureFields: ProductFieldSpec[] = [
  { name: 'features.frontUsbCHeader', kind: 'choice', options: () => options(frontUsbCHeaders, frontUsbCHeaderLabels) },
  {
    name: 'features.lanSpeedMbps',
    kind: 'choice',
    options: (values) => lanOptions(values['features.lanSpeedMbps']),
    description: 'The fastest wired port.',
  },
  { name: 'features.wifi', kind: 'choice', options: () => options(wifiGenerations, wifiGenerationLabels) },
  { name: 'features.m2Slots', kind: 'integer' },
  { name: 'features.sataPorts', kind: 'integer' },
  {
    name: 'features.ioShieldPrefitted',
    kind: 'choice',
    options: () => [
      { value: 'yes', label: 'Pre-fitted' },
      { value: 'no', label: 'Separate plate' },
    ],
  },
  {
    name: 'features.audio',
    kind: 'text',
    className: 'sm:col-span-2 lg:col-span-3',
    description: 'In words, e.g. “7.1 HD audio, optical out”.',
  },
];

/** All fields of a catalog product: identity, the V-core power design and the board's features. */
export function ProductForm({ initialValues, submitLabel, cancelTo, save, onSaved, errorTitle }: ProductFormProps) {
  const form = useZodForm({
    schema: createProductRequestSchema,
    initialValues,
    labels: productFieldLabels,
    messages: { formFactor: 'Choose the form factor.' },
    toRequest: productRequestFrom,
    issueMessage: productIssueMessage,
  });
  const [pending, setPending] = useState(false);
  const saved = useRef(false);
  const { values } = form;

  const blocker = useBlocker(
    ({ currentLocation, nextLocation }) =>
      form.dirty && !saved.current && currentLocation.pathname !== nextLocation.pathname,
  );

  useEffect(() => {
    if (!form.dirty) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [form.dirty]);

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const input = form.validate();
    if (!input) return;
    setPending(true);
    try {
      const product = await save(input);
      saved.current = true;
      onSaved(product);
    } catch (error) {
      form.fail(error);
    } finally {
      setPending(false);
    }
  };

  return (
    <form noValidate onSubmit={submit} className="space-y-6">
      <FormErrorSummary {...form.problems(errorTitle)} />

      <FormSection title="Product" description="What the board is and where it fits.">
        <ProductFields form={form} fields={identityFields} className="grid gap-4 sm:grid-cols-2" />
      </FormSection>

      <FormSection
        title="V-core power design"
        description="Leave a field empty while it is not known. Effective phases are worked out from the controller phases and how they are multiplied."
      >
        <ProductFields form={form} fields={powerDesignFields} className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3" />
        <PowerDesignSummary values={values} />
        <ProductFields form={form} fields={powerDesignNoteFields} className="mt-4 grid gap-4 lg:grid-cols-2" />
      </FormSection>

      <FormSection title="Features" description="Counts are ports or slots on the board; leave empty when not known.">
        <fieldset>
          <legend className="mb-2 text-sm font-semibold text-ink">Rear USB ports by speed</legend>
          <ProductFields form={form} fields={rearUsbFields} className="grid grid-cols-2 gap-3 sm:grid-cols-5" />
        </fieldset>
        <ProductFields form={form} fields={featureFields} className="mt-4 grid gap-4 sm:grid-cols-2 lg:grid-cols-3" />
      </FormSection>

      <div className="flex flex-wrap items-center gap-3 border-t border-rule pt-4">
        <Button type="submit" variant="primary" pending={pending}>
          {submitLabel}
        </Button>
        <Link to={cancelTo} className={buttonStyles('quiet')}>
          Cancel
        </Link>
        {form.dirty && <p className="text-sm text-muted">Unsaved changes</p>}
      </div>

      <ConfirmDialog
        open={blocker.state === 'blocked'}
        title="Leave without saving?"
        confirmLabel="Leave and discard"
        cancelLabel="Stay on the form"
        onConfirm={() => blocker.proceed?.()}
        onCancel={() => blocker.reset?.()}
      >
        <p>What you typed in this form has not been saved yet.</p>
      </ConfirmDialog>
    </form>
  );
}

interface ProductFieldsProps {
  form: {
    values: ProductFormValues;
    field: (name: ProductField) => {
      id: string;
      name: string;
      label: string;
      value: string;
      error?: string;
      onChange: (event: ChangeEvent<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>) => void;
    };
  };
  fields: ProductFieldSpec[];
  className: string;
}

/** One grid of the form, each field drawn from its line in the field table. */
function ProductFields({ form, fields, className }: ProductFieldsProps) {
  return (
    <div className={className}>
      {fields.map((spec) => (
        <ProductFieldControl key={spec.name} form={form} spec={spec} />
      ))}
    </div>
  );
}

function ProductFieldControl({ form, spec }: { form: ProductFieldsProps['form']; spec: ProductFieldSpec }) {
  const common = {
    ...form.field(spec.name),
    optional: !requiredFields.has(spec.name),
    description: spec.description,
    className: spec.className,
  };
  switch (spec.kind) {
    case 'choice':
      return (
        <Select
          {...common}
          placeholder={common.optional ? 'Not known' : 'Choose…'}
          options={spec.options(form.values)}
        />
      );
    case 'notes':
      return <TextArea {...common} rows={2} />;
    case 'text':
      return <TextField {...common} autoComplete="off" />;
    case 'date':
      return <TextField {...common} type="date" />;
    case 'decimal':
      return <TextField {...common} inputMode="decimal" />;
    case 'integer':
      return <TextField {...common} inputMode="numeric" />;
    case 'count':
      return <TextField {...common} inputMode="numeric" inputClassName="numeric" />;
  }
}

function FormSection({ title, description, children }: { title: string; description?: string; children: ReactNode }) {
  return (
    <fieldset className="min-w-0 rounded-[3px] border border-rule bg-surface px-4 pt-3 pb-4">
      <legend className="px-1 text-base font-semibold text-ink">{title}</legend>
      {description && <p className="mb-4 max-w-[70ch] text-sm text-muted">{description}</p>}
      {children}
    </fieldset>
  );
}

/** What the typed design adds up to, worked out with the same rules the server uses. */
function PowerDesignSummary({ values }: { values: ProductFormValues }) {
  const phases = readNumber(values['powerDesign.controllerPhases'], true);
  const multiplication = values['powerDesign.phaseMultiplication'] as (typeof phaseMultiplications)[number] | '';
  const stages = readNumber(values['powerDesign.stagesPerPhase'], true);
  const rating = readNumber(values['powerDesign.vcoreStageCurrentA'], false);

  const effective =
    typeof phases === 'number' && phases > 0 && multiplication ? effectivePhaseCount(phases, multiplication) : null;
  const stageCount =
    effective !== null && typeof phases === 'number' && typeof stages === 'number' && stages > 0 && multiplication
      ? vcoreStageCount(phases, multiplication, stages)
      : null;
  const ratedSum = stageCount !== null && typeof rating === 'number' ? vcoreRatedCurrentA(stageCount, rating) : null;

  return (
    <dl
      aria-live="polite"
      className="mt-4 grid grid-cols-1 gap-x-6 gap-y-1 rounded-[3px] border border-dashed border-edge bg-wash/60 px-3 py-2 text-sm sm:grid-cols-3"
    >
      <SummaryItem term="Effective phases" value={effective === null ? '—' : String(effective)} />
      <SummaryItem term="V-core stages" value={stageCount === null ? '—' : String(stageCount)} />
      <SummaryItem term="Sum of stage ratings" value={ratedSum === null ? '—' : formatAmps(ratedSum)} />
    </dl>
  );
}

function SummaryItem({ term, value }: { term: string; value: string }) {
  return (
    <div className="flex items-baseline justify-between gap-3 sm:block">
      <dt className="text-muted">{term}</dt>
      <dd className="numeric text-ink">{value}</dd>
    </div>
  );
}
