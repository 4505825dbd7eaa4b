import { useId, useMemo, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { Panel } from '../../../components/ui/panel';
import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import { SuggestingField } from '../../../components/ui/suggesting-field';
import { ApiError, isApiError } from '../../../lib/api-client';
import { userTimeZone } from '../../../lib/format-time';
import { useZodForm } from '../../../lib/use-zod-form';
import { formSchema } from '../../../lib/form-schema';
import { minorUnitDigits, parseMajorAmount } from '../../../../shared/domain/planning/money';
import { productCategoryLabels, productCategories, type ProductCategory } from '../../../../shared/schemas/catalog';
import {
  createRoundupRequestSchema,
  type CreateRoundupRequest,
  type RoundupDetail,
} from '../../../../shared/schemas/roundups';
import { useBenchProfiles } from '../api/bench-profiles';
import { useCatalogProducts } from '../api/get-catalog-products';
import { useCreateRoundup } from '../api/create-roundup';
import { useLoadConfigurations } from '../api/load-configurations';
import { BenchProfilePicker } from './bench-profile-picker';
import { uniqueById, usePlanDialogs } from './plan-dialogs';
import { LoadConfigurationPlan } from './load-configuration-plan';

// Field names follow the request's paths, so the server's field errors ("priceBand.minMinor") land beside
// the right field without translation.
const emptyForm = {
  title: '',
  category: 'motherboard',
  platform: '',
  'priceBand.minMinor': '',
  'priceBand.maxMinor': '',
  'priceBand.currency': 'EUR',
  'priceBand.region': '',
  targetPublishDate: '',
  timeZone: userTimeZone(),
  benchProfileId: '',
};
type FormValues = typeof emptyForm;

const labels: Record<keyof FormValues, string> = {
  title: 'Title',
  category: 'Product category',
  platform: 'Platform',
  'priceBand.minMinor': 'Lowest price',
  'priceBand.maxMinor': 'Highest price',
  'priceBand.currency': 'Currency',
  'priceBand.region': 'Region',
  targetPublishDate: 'Target publish date',
  timeZone: 'Outlet time zone',
  benchProfileId: 'Bench profile',
};

/**
 * The form's text values become the create request: amounts typed in major units ("189.99") are read into
 * integer minor units for the band's currency without floating point, and the shared schema checks the whole in
 * the same pass, so an empty form shows every missing field at once.
 */
export const roundupFormSchema = formSchema(
  createRoundupRequestSchema,
  (values: FormValues, flag): CreateRoundupRequest => {
    const currency = values['priceBand.currency'].trim().toUpperCase();
    const amount = (key: 'priceBand.minMinor' | 'priceBand.maxMinor', empty: string) => {
      const text = values[key].trim();
      if (!text) {
        flag(key, empty);
        return Number.NaN;
      }
      const parsed = parseMajorAmount(text, /^[A-Z]{3}$/.test(currency) ? currency : 'EUR');
      if (!parsed.ok) {
        flag(key, parsed.message);
        return Number.NaN;
      }
      return parsed.amountMinor;
    };
    const minMinor = amount('priceBand.minMinor', 'Enter the lowest price of the band.');
    const maxMinor = amount('priceBand.maxMinor', 'Enter the highest price of the band.');
    return {
      title: values.title,
      category: values.category as ProductCategory,
      platform: values.platform,
      priceBand: { minMinor, maxMinor, currency, region: values['priceBand.region'] },
      targetPublishDate: values.targetPublishDate.trim() || null,
      timeZone: values.timeZone,
      benchProfileId: values.benchProfileId ? Number(values.benchProfileId) : null,
    };
  },
);

const categoryOptions = productCategories.map((category) => ({
  value: category,
  label: productCategoryLabels[category],
}));

function timeZoneNames(): string[] {
  const supported = (Intl as { supportedValuesOf?: (key: string) => string[] }).supportedValuesOf;
  return supported ? supported('timeZone') : [];
}

export interface CreateRoundupFormProps {
  onCreated: (roundup: RoundupDetail) => void;
  onCancel: () => void;
}

/** Plans a new roundup: what is compared, in which price band, when it should publish, and how it is tested. */
export function CreateRoundupForm({ onCreated, onCancel }: CreateRoundupFormProps) {
  const formId = useId();
  const profiles = useBenchProfiles();
  const savedConfigurations = useLoadConfigurations();
  const catalog = useCatalogProducts({ limit: 1 });
  const createRoundup = useCreateRoundup();
  const form = useZodForm({ schema: roundupFormSchema, initialValues: emptyForm, labels });

  const [configurationIds, setConfigurationIds] = useState<number[]>([]);
  const [configurationsError, setConfigurationsError] = useState<string | undefined>();
  // Made in this form: shown at once, before the refreshed lists arrive.
  const plan = usePlanDialogs({
    onProfile: (profile) => form.setValue('benchProfileId', String(profile.id)),
    onConfiguration: (configuration) => setConfigurationIds((current) => [...current, configuration.id]),
  });
  const { madeProfiles, madeConfigurations } = plan;
  const allProfiles = useMemo(() => uniqueById(profiles, madeProfiles), [profiles, madeProfiles]);
  const allConfigurations = useMemo(
    () => uniqueById(savedConfigurations, madeConfigurations),
    [savedConfigurations, madeConfigurations],
  );
  const chosenProfile = allProfiles.find((p) => String(p.id) === form.values.benchProfileId);
  const platforms = catalog.data?.facets.platforms ?? [];
  const zones = useMemo(() => timeZoneNames(), []);
  const currency = form.values['priceBand.currency'].trim().toUpperCase();
  const digits = /^[A-Z]{3}$/.test(currency) ? minorUnitDigits(currency) : 2;
  const amountHint =
    digits === 0 ? 'Whole units, e.g. 25000.' : `In ${currency || 'the currency'}, e.g. 189.${'9'.repeat(digits)}.`;

  const submit = form.handleSubmit(
    (parsed) =>
      createRoundup.mutate(
        { ...parsed, loadConfigurationIds: configurationIds },
        {
          onSuccess: onCreated,
          onError: (error) => {
            if (!isApiError(error)) return form.fail(error);
            const listProblem = Object.entries(error.fields).find(([key]) => key.startsWith('loadConfigurationIds'));
            if (listProblem) setConfigurationsError(listProblem[1]);
            const others = Object.fromEntries(
              Object.entries(error.fields).filter(([key]) => !key.startsWith('loadConfigurationIds')),
            );
            form.fail(new ApiError(error.status, error.code, error.message, others));
          },
        },
      ),
    () => setConfigurationsError(undefined),
  );

  return (
    <>
      <form id={formId} noValidate onSubmit={submit} className="space-y-5">
        <FormErrorSummary
          title="The roundup was not created"
          items={form.summaryItems}
          message={form.formError ?? configurationsError}
          attempt={form.attempt}
        />

        <Panel title="What is compared">
          <div className="grid gap-4 sm:grid-cols-2">
            <TextField
              {...form.field('title')}
              autoComplete="off"
              className="sm:col-span-2"
              placeholder="Boards for the new platform, mid-price"
            />
            <Select {...form.field('category')} options={categoryOptions} />
            <SuggestingField
              {...form.field('platform')}
              suggestions={platforms}
              description="As the catalog names it: suggestions come from products of this platform."
            />
          </div>
        </Panel>

        <Panel
          title="Price band"
          description="Suggestions are catalog products whose latest price in this region falls inside the band. Prices are never converted between currencies."
        >
          <div className="grid gap-4 sm:grid-cols-4">
            <TextField
              {...form.field('priceBand.minMinor')}
              inputMode="decimal"
              autoComplete="off"
              description={amountHint}
            />
            <TextField {...form.field('priceBand.maxMinor')} inputMode="decimal" autoComplete="off" />
            <TextField
              {...form.field('priceBand.currency')}
              autoComplete="off"
              maxLength={3}
              description="ISO code, e.g. EUR."
              inputClassName="uppercase"
            />
            <TextField
              {...form.field('priceBand.region')}
              autoComplete="off"
              maxLength={8}
              description="e.g. DE, GB, US or EU."
              inputClassName="uppercase"
            />
          </div>
        </Panel>

        <Panel title="Timing">
          <div className="grid gap-4 sm:grid-cols-2">
            <TextField {...form.field('targetPublishDate')} type="date" optional />
            <SuggestingField
              {...form.field('timeZone')}
              suggestions={zones}
              description="Due dates and loan return-by dates end at midnight in this zone."
            />
          </div>
        </Panel>

        <Panel title="Test plan" description="Both can still change while the roundup is Planning or On the bench.">
          <div className="space-y-6">
            <BenchProfilePicker
              id={form.fieldId('benchProfileId')}
              profiles={allProfiles}
              value={form.values.benchProfileId}
              onChange={(value) => form.setValue('benchProfileId', value)}
              onCreateNew={plan.newProfile}
              error={form.errors.benchProfileId}
            />
            <LoadConfigurationPlan
              configurations={allConfigurations}
              value={configurationIds}
              onChange={(ids) => {
                setConfigurationIds(ids);
                setConfigurationsError(undefined);
              }}
              onCreateNew={plan.newConfiguration}
              requiredSoakMinutes={chosenProfile?.requiredSoakMinutes}
              error={configurationsError}
            />
          </div>
        </Panel>

        <div className="flex flex-wrap gap-2">
          <Button type="submit" variant="primary" pending={createRoundup.isPending}>
            Create roundup
          </Button>
          <Button onClick={onCancel}>Cancel</Button>
        </div>
      </form>

      {plan.dialogs}
    </>
  );
}
