import { useEffect, useRef, useState, type FormEvent, type ReactNode } from 'react';
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
      <FormErrorSummary title={errorTitle} items={form.summaryItems} message={form.formError} attempt={form.attempt} />

      <FormSection title="Product" description="What the board is and where it fits.">
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField {...form.field('maker')} autoComplete="off" />
          <TextField {...form.field('model')} autoComplete="off" />
          <TextField {...form.field('platform')} autoComplete="off" description="The CPU platform, e.g. Helix-1700." />
          <TextField {...form.field('socket')} autoComplete="off" />
          <TextField {...form.field('chipset')} autoComplete="off" />
          <Select
            {...form.field('formFactor')}
            options={options(formFactors, formFactorLabels)}
            placeholder="Choose…"
          />
          <TextField {...form.field('releaseDate')} type="date" optional />
        </div>
      </FormSection>

      <FormSection
        title="V-core power design"
        description="Leave a field empty while it is not known. Effective phases are worked out from the controller phases and how they are multiplied."
      >
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          <TextField {...form.field('powerDesign.controller')} optional autoComplete="off" description="Its marking." />
          <TextField
            {...form.field('powerDesign.controllerPhases')}
            optional
            inputMode="numeric"
            description="Phases the controller drives, 1–32."
          />
          <Select
            {...form.field('powerDesign.phaseMultiplication')}
            optional
            placeholder="Not known"
            options={options(phaseMultiplications, phaseMultiplicationLabels)}
          />
          <TextField
            {...form.field('powerDesign.stagesPerPhase')}
            optional
            inputMode="numeric"
            description="1 for direct and doubled; 2 or more when teamed."
          />
          <Select
            {...form.field('powerDesign.vcoreStageType')}
            optional
            placeholder="Not known"
            options={options(vcoreStageTypes, vcoreStageTypeLabels)}
          />
          <TextField
            {...form.field('powerDesign.vcoreStagePart')}
            optional
            autoComplete="off"
            description="As printed on the stage or MOSFET."
          />
          <TextField
            {...form.field('powerDesign.vcoreStageCurrentA')}
            optional
            inputMode="decimal"
            description="Continuous current of one stage in A, e.g. 60 or 62.5."
          />
          <TextField
            {...form.field('powerDesign.socRailStages')}
            optional
            inputMode="numeric"
            description="Stages on the SoC rail."
          />
        </div>
        <PowerDesignSummary values={values} />
        <div className="mt-4 grid gap-4 lg:grid-cols-2">
          <TextArea
            {...form.field('powerDesign.otherRails')}
            optional
            rows={2}
            description="In words, e.g. “1 stage graphics, 1 stage auxiliary”."
          />
          <TextArea
            {...form.field('powerDesign.heatsinkNotes')}
            optional
            rows={2}
            description="Fins, heat pipes, pads, contact with the stages."
          />
        </div>
      </FormSection>

      <FormSection title="Features" description="Counts are ports or slots on the board; leave empty when not known.">
        <fieldset>
          <legend className="mb-2 text-sm font-semibold text-ink">Rear USB ports by speed</legend>
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-5">
            {(['usb2', 'usb5g', 'usb10g', 'usb20g', 'usb40g'] as const).map((speed) => (
              <TextField
                key={speed}
                {...form.field(`features.rearUsb.${speed}`)}
                optional
                inputMode="numeric"
                inputClassName="numeric"
              />
            ))}
          </div>
        </fieldset>
        <div className="mt-4 grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          <Select
            {...form.field('features.frontUsbCHeader')}
            optional
            placeholder="Not known"
            options={options(frontUsbCHeaders, frontUsbCHeaderLabels)}
          />
          <Select
            {...form.field('features.lanSpeedMbps')}
            optional
            placeholder="Not known"
            options={lanOptions(values['features.lanSpeedMbps'])}
            description="The fastest wired port."
          />
          <Select
            {...form.field('features.wifi')}
            optional
            placeholder="Not known"
            options={options(wifiGenerations, wifiGenerationLabels)}
          />
          <TextField {...form.field('features.m2Slots')} optional inputMode="numeric" />
          <TextField {...form.field('features.sataPorts')} optional inputMode="numeric" />
          <Select
            {...form.field('features.ioShieldPrefitted')}
            optional
            placeholder="Not known"
            options={[
              { value: 'yes', label: 'Pre-fitted' },
              { value: 'no', label: 'Separate plate' },
            ]}
          />
          <TextField
            {...form.field('features.audio')}
            optional
            autoComplete="off"
            className="sm:col-span-2 lg:col-span-3"
            description="In words, e.g. “7.1 HD audio, optical out”."
          />
        </div>
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
