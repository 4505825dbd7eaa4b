import { useId, useState, type FormEvent } from 'react';
import { Alert, ListAlert } from '../../../components/ui/alert';
import { Badge, type BadgeTone } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Panel } from '../../../components/ui/panel';
import { Select } from '../../../components/ui/select';
import { TextArea } from '../../../components/ui/text-area';
import { TextField } from '../../../components/ui/text-field';
import { describeSubmitError } from '../../../lib/form-errors';
import { formatPrice } from '../../../lib/format-money';
import { editorialLabelNames, editorialLabels } from '../../../../shared/domain/editorial/editorial-labels';
import { verdictContradictions } from '../../../../shared/domain/editorial/verdict-contradiction';
import { minorToMajorString, parseMajorAmount } from '../../../../shared/domain/planning/money';
import type { ProductVerdict } from '../../../../shared/schemas/verdicts';
import { setVerdictRequestSchema } from '../../../../shared/schemas/verdicts';
import type { VerdictCode } from '../../../../shared/schemas/analysis';

const verdictTones: Record<VerdictCode, BadgeTone> = {
  comfortable: 'positive',
  warm: 'caution',
  'hot-but-held': 'caution',
  throttled: 'negative',
};

type Field = 'label' | 'bestFor' | 'price' | 'currency' | 'reason';

/** One product: the rubric verdicts of its runs of record as evidence, and the editor's verdict beside them. */
export function VerdictCard({
  product,
  currency,
  editable,
  saving,
  onSave,
}: {
  product: ProductVerdict;
  currency: string;
  editable: boolean;
  saving: boolean;
  onSave: (body: ReturnType<typeof setVerdictRequestSchema.parse>) => Promise<unknown>;
}) {
  const formId = useId();
  const start = product.verdict?.price ?? product.catalogPrice;
  const [values, setValues] = useState<Record<Field, string>>({
    label: product.verdict?.label ?? '',
    bestFor: product.verdict?.bestFor ?? '',
    price: start ? minorToMajorString(start.amountMinor, start.currency) : '',
    currency: start?.currency ?? currency,
    reason: product.verdict?.reason ?? '',
  });
  const [errors, setErrors] = useState<Partial<Record<Field, string>>>({});
  const [formError, setFormError] = useState<string>();
  const [saved, setSaved] = useState(false);
  const set = (field: Field, value: string) => {
    setValues((current) => ({ ...current, [field]: value }));
    setErrors((current) => ({ ...current, [field]: undefined }));
    setSaved(false);
  };
  const label = editorialLabels.find((l) => l === values.label);
  const contradictions = label ? verdictContradictions(label, product.evidence) : [];

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const problems: Partial<Record<Field, string>> = {};
    const amount = parseMajorAmount(values.price, values.currency.trim().toUpperCase() || currency);
    if (!amount.ok) problems.price = values.price.trim() ? amount.message : 'Enter the price at publication.';
    const body = {
      label: values.label,
      bestFor: values.bestFor,
      price: { amountMinor: amount.ok ? amount.amountMinor : 0, currency: values.currency.trim().toUpperCase() },
      reason: values.reason.trim() ? values.reason : undefined,
    };
    const parsed = setVerdictRequestSchema.safeParse(body);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const path = issue.path.join('.');
        const field: Field =
          path === 'price.currency' ? 'currency' : path.startsWith('price') ? 'price' : (path as Field);
        problems[field] ??= issue.path[0] === 'label' ? 'Choose a label from the list.' : issue.message;
      }
    }
    if (contradictions.length > 0 && !values.reason.trim()) {
      problems.reason = 'This label goes against the measurements: write why it stands.';
    }
    setErrors(problems);
    setFormError(undefined);
    if (Object.keys(problems).length > 0 || !parsed.success) return;
    try {
      await onSave(parsed.data);
      setSaved(true);
    } catch (error) {
      const { fields, message } = describeSubmitError(error);
      const next: Partial<Record<Field, string>> = {};
      for (const [name, text] of Object.entries(fields)) {
        if (name === 'price.currency') next.currency = text;
        else if (name.startsWith('price')) next.price = text;
        else if (['label', 'bestFor', 'reason'].includes(name)) next[name as Field] = text;
      }
      setErrors(next);
      setFormError(Object.keys(next).length === 0 ? message : undefined);
    }
  };

  return (
    <Panel
      id={`verdict-${product.entryId}`}
      title={product.productName}
      actions={
        product.verdict ? (
          <Badge tone="accent">{editorialLabelNames[product.verdict.label]}</Badge>
        ) : (
          <Badge tone="muted">No verdict yet</Badge>
        )
      }
      bodyClassName="grid gap-4 md:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]"
    >
      <div>
        <h3 className="mb-2 text-sm font-semibold text-ink">Measurements (runs of record)</h3>
        <ul className="space-y-1.5 text-sm">
          {product.evidence.map((evidence) => (
            <li key={evidence.loadConfigurationId} className="flex flex-wrap items-center gap-2">
              <span className="min-w-0 text-ink">{evidence.loadConfigurationName}</span>
              {!evidence.hasRunOfRecord ? (
                <Badge tone="muted">No run of record</Badge>
              ) : evidence.verdictCode === null || evidence.verdictStatus === 'withheld' ? (
                <Badge tone="muted">{evidence.verdictLabel ?? 'No verdict yet'}</Badge>
              ) : (
                <Badge
                  tone={verdictTones[evidence.verdictCode]}
                  className={evidence.verdictStatus === 'provisional' ? 'border-dashed' : undefined}
                >
                  {evidence.verdictLabel ?? evidence.verdictCode}
                </Badge>
              )}
              {evidence.peakC !== null && (
                <span className="numeric text-muted">{`${evidence.peakC.toFixed(1)}\u2009°C`}</span>
              )}
            </li>
          ))}
        </ul>
        {product.verdict?.updatedBy && (
          <p className="mt-3 text-xs text-muted">
            Set by {product.verdict.updatedBy.displayName}, price {formatPrice(product.verdict.price)}.
          </p>
        )}
      </div>
      {editable ? (
        <form id={formId} noValidate onSubmit={submit} className="space-y-3">
          <Select
            label="Label"
            placeholder="Choose a label…"
            value={values.label}
            onChange={(event) => set('label', event.target.value)}
            options={editorialLabels.map((l) => ({ value: l, label: editorialLabelNames[l] }))}
            error={errors.label}
          />
          <TextField
            label="Best for"
            description="One line: who should buy this board."
            value={values.bestFor}
            maxLength={160}
            onChange={(event) => set('bestFor', event.target.value)}
            error={errors.bestFor}
          />
          <div className="grid grid-cols-[minmax(0,2fr)_minmax(0,1fr)] gap-3">
            <TextField
              label="Price at publication"
              inputMode="decimal"
              value={values.price}
              onChange={(event) => set('price', event.target.value)}
              error={errors.price}
              description={product.catalogPrice ? `Catalog: ${formatPrice(product.catalogPrice)}` : undefined}
            />
            <TextField
              label="Currency"
              value={values.currency}
              maxLength={3}
              autoCapitalize="characters"
              onChange={(event) => set('currency', event.target.value)}
              error={errors.currency}
            />
          </div>
          {contradictions.length > 0 && (
            <ListAlert tone="warning" title="This label goes against the measurements" items={contradictions} />
          )}
          <TextArea
            label="Reason"
            optional={contradictions.length === 0}
            description="Needed when the label goes against the measurements."
            value={values.reason}
            rows={3}
            maxLength={2000}
            onChange={(event) => set('reason', event.target.value)}
            error={errors.reason}
          />
          {formError && (
            <Alert tone="danger" announce>
              {formError}
            </Alert>
          )}
          <div className="flex items-center gap-3">
            <Button type="submit" variant="primary" pending={saving}>
              Save verdict
            </Button>
            {saved && (
              <span role="status" className="text-sm text-teal">
                Saved
              </span>
            )}
          </div>
        </form>
      ) : (
        <div className="text-sm text-ink">
          {product.verdict ? (
            <>
              <p>
                <strong>{editorialLabelNames[product.verdict.label]}</strong> — best for {product.verdict.bestFor}
              </p>
              {product.verdict.reason && <p className="mt-2 text-muted">Reason: {product.verdict.reason}</p>}
            </>
          ) : (
            <p className="text-muted">No verdict yet.</p>
          )}
        </div>
      )}
    </Panel>
  );
}
