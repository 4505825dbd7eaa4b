import { Button } from '../../../components/ui/button';
import { FormErrorSummary } from '../../../components/ui/form-error-summary';
import { Panel } from '../../../components/ui/panel';
import { AnalysisOptionFields } from './analysis-option-fields';
import { ColumnRoleFields } from './column-role-fields';
import { TemperatureUnitFields } from './temperature-unit-fields';
import { useMappingForm, type UseMappingFormOptions } from './use-mapping-form';

export interface ColumnMappingFormProps extends Omit<UseMappingFormOptions, 'disabled'> {
  /** An analysis with this mapping is on its way. */
  pending: boolean;
  /** The file is being read again: the fields wait for it. */
  disabled?: boolean;
}

/**
 * The tester's mapping of columns to roles and the analysis options. It opens with the server's guess, marked on every
 * field it filled in, and sends nothing until the tester presses Analyse.
 */
export function ColumnMappingForm({ pending, disabled = false, ...props }: ColumnMappingFormProps) {
  const form = useMappingForm({ ...props, disabled });
  const { errors, summaryItems } = form;

  return (
    <form noValidate onSubmit={form.submit} aria-label="Column mapping and analysis options" className="space-y-5">
      <FormErrorSummary
        title="Nothing was analysed yet"
        items={summaryItems}
        message={summaryItems.length === 0 && Object.keys(errors).length > 0 ? Object.values(errors)[0] : undefined}
        attempt={form.attempt}
      />

      <Panel
        title="Column mapping"
        description="Which column is which. The server reads the file again with exactly this mapping."
      >
        <ColumnRoleFields form={form} guessed={props.guess !== null} />
        <TemperatureUnitFields form={form} />
      </Panel>

      <Panel
        title="Analysis options"
        description="The schema’s defaults; change them to match the load configuration and the bench."
      >
        <AnalysisOptionFields form={form} />
      </Panel>

      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" variant="primary" pending={pending} disabled={disabled}>
          Analyse
        </Button>
        <p className="text-[0.8125rem] text-muted">Sends the same file again with this mapping and these options.</p>
      </div>
    </form>
  );
}
