import { useState } from 'react';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { TextField } from '../../../components/ui/text-field';
import { SuggestingField, type SuggestingFieldProps } from '../../../components/ui/suggesting-field';
import { ApiError, isApiError } from '../../../lib/api-client';
import { useZodForm } from '../../../lib/use-zod-form';
import { formSchema } from '../../../lib/form-schema';
import { parseMajorAmount } from '../../../../shared/domain/planning/money';
import { createPriceRequestSchema, type CreatePriceRequest, type Price } from '../../../../shared/schemas/catalog';
import { useAddPrice } from '../api/prices';
import { formatPrice } from '../../../lib/format-money';
import { userTimeZone } from '../../../lib/format-time';
import { todayIn } from '../../../../shared/schemas/dates';
import { SubmitRow } from '../../../components/ui/submit-row';

/**
 * The form works in major units ("189.99"), as a price tag shows it; the request carries integer minor units, parsed
 * without floating point by the shared money rules, then checked by the same schema the server uses.
 */
const priceFormSchema = formSchema(
  createPriceRequestSchema,
  (
    values: { region: string; currency: string; amount: string; observedOn: string; source: string },
    flag,
  ): CreatePriceRequest => {
    const currency = values.currency.trim().toUpperCase();
    let amountMinor = Number.NaN;
    if (!values.amount.trim()) flag('amount', 'Enter the price.');
    else {
      const parsed = parseMajorAmount(values.amount, /^[A-Z]{3}$/.test(currency) ? currency : 'EUR');
      if (parsed.ok) amountMinor = parsed.amountMinor;
      else flag('amount', parsed.message);
    }
    return {
      region: values.region,
      currency: values.currency,
      amountMinor,
      observedOn: values.observedOn,
      source: values.source,
    };
  },
  (path) => (path === 'amountMinor' ? 'amount' : path),
);

const today = () => todayIn(userTimeZone());

/** The server names the amount field amountMinor; this form calls it amount. */
function renameAmountField(error: unknown) {
  if (!isApiError(error) || !error.fields.amountMinor) return error;
  const { amountMinor, ...fields } = error.fields;
  return new ApiError(error.status, error.code, error.message, { ...fields, amount: amountMinor });
}

export interface AddPriceFormProps {
  productId: number;
  /** Regions and currencies already used, offered as suggestions. */
  knownRegions: readonly string[];
  knownCurrencies: readonly string[];
  onAdded?: (price: Price) => void;
}

/** A short code typed in capitals (region, currency), with the codes already used offered as suggestions. */
function CodeField(field: SuggestingFieldProps) {
  return <SuggestingField {...field} autoCapitalize="characters" inputClassName="uppercase" />;
}

export function AddPriceForm({ productId, knownRegions, knownCurrencies, onAdded }: AddPriceFormProps) {
  const addPrice = useAddPrice();
  const [saved, setSaved] = useState<string | null>(null);
  const form = useZodForm({
    schema: priceFormSchema,
    initialValues: { region: '', currency: '', amount: '', observedOn: today(), source: '' },
    labels: {
      region: 'Region',
      currency: 'Currency',
      amount: 'Price',
      observedOn: 'Seen on',
      source: 'Source',
    },
  });

  const submit = form.handleSubmit(
    (input) =>
      addPrice.mutate(
        { productId, price: input },
        {
          onSuccess: (price) => {
            form.reset({ ...form.values, amount: '', source: '' });
            setSaved(`Added ${formatPrice(price)} in ${price.region}.`);
            onAdded?.(price);
          },
          onError: (error) => form.fail(renameAmountField(error)),
        },
      ),
    () => setSaved(null),
  );

  return (
    <form noValidate onSubmit={submit} className="space-y-3" aria-label="Add a price">
      <FormErrorSummary {...form.problems('The price was not added')} />
      <div className="grid grid-cols-2 gap-3">
        <CodeField {...form.field('region')} suggestions={knownRegions} description="e.g. DE, GB, US" />
        <CodeField {...form.field('currency')} suggestions={knownCurrencies} description="ISO 4217, e.g. EUR" />
        <TextField
          {...form.field('amount')}
          inputMode="decimal"
          autoComplete="off"
          description="e.g. 189.99"
          inputClassName="numeric"
        />
        <TextField {...form.field('observedOn')} type="date" />
      </div>
      <TextField
        {...form.field('source')}
        autoComplete="off"
        description="Shop name, or a note such as “maker’s list price”."
      />
      <SubmitRow label="Add price" pending={addPrice.isPending} done={saved} />
    </form>
  );
}
