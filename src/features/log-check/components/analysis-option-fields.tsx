import { Checkbox } from '../../../components/ui/checkbox';
import { Select } from '../../../components/ui/select';
import { TextField } from '../../../components/ui/text-field';
import { thermocoupleToleranceClasses } from '../../../../shared/domain/analysis/thermocouple-tolerance';
import { toleranceClasses, type ToleranceClass } from '../../../../shared/schemas/analysis';
import { defaultOptions, optionFigures, type OptionFigure } from './option-figures';
import { Unit } from './temperature-unit-fields';
import { fieldLabels, type MappingForm } from './use-mapping-form';

const toleranceOptions = toleranceClasses.map((value) => ({
  value,
  label: thermocoupleToleranceClasses[value].standard,
}));

const figures: readonly OptionFigure[] = optionFigures;
const mainFigures = figures.filter((figure) => figure.group === 'main');
const limitFigures = figures.filter((figure) => figure.group === 'limits');

function FigureField({ form, figure }: { form: MappingForm; figure: OptionFigure }) {
  return <TextField {...form.figureField(figure)} addon={<Unit>{figure.unit}</Unit>} />;
}

/** The analysis options: the figures of option-figures.ts in their groups, the probe class and the tester's marks. */
export function AnalysisOptionFields({ form }: { form: MappingForm }) {
  const { draft, errors, id, disabled, update } = form;
  const limitsHaveErrors = limitFigures.some((figure) => errors[figure.name as keyof typeof errors]);

  return (
    <>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        {mainFigures.map((figure) => (
          <FigureField key={figure.name} form={form} figure={figure} />
        ))}
      </div>
      <div className="mt-4 grid gap-4 sm:grid-cols-2">
        <Select
          id={id('toleranceClass')}
          label={fieldLabels.toleranceClass}
          options={toleranceOptions}
          value={draft.toleranceClass}
          error={errors.toleranceClass}
          disabled={disabled}
          description="Sets the ± band printed with the peak."
          onChange={(event) => update({ toleranceClass: event.target.value as ToleranceClass }, ['toleranceClass'])}
        />
      </div>
      <div className="mt-4 space-y-3">
        <Checkbox
          id={id('useNormalizedPeak')}
          label="Judge the normalised peak"
          checked={draft.useNormalizedPeak}
          disabled={disabled}
          description={`The verdict uses ${defaultOptions.referenceRoomC}\u2009°C plus the delta over ambient instead of the absolute peak (needs an ambient column).`}
          onChange={(event) => update({ useNormalizedPeak: event.target.checked }, [])}
        />
        <Checkbox
          id={id('testerMarkedUnstable')}
          label="The system was unstable during the soak (crash or reset)"
          checked={draft.testerMarkedUnstable}
          disabled={disabled}
          description="An unstable run fails, whatever the temperatures."
          onChange={(event) => update({ testerMarkedUnstable: event.target.checked }, [])}
        />
        {draft.confirmedDeadProbes.map((column) => (
          <Checkbox
            key={column}
            id={id(`dead:${column}`)}
            label={`${column} is a dead probe: judge the run without it`}
            checked
            disabled={disabled}
            description="You confirmed it after it read nothing. Clear this to have its missing readings withhold the verdict again."
            onChange={() =>
              update({ confirmedDeadProbes: draft.confirmedDeadProbes.filter((name) => name !== column) }, [])
            }
          />
        ))}
      </div>
      <details className="mt-4" open={limitsHaveErrors || undefined}>
        <summary className="cursor-pointer text-sm font-semibold text-ink">Throttle rule and verdict limits</summary>
        <div className="mt-3 grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
          {limitFigures.map((figure) => (
            <FigureField key={figure.name} form={form} figure={figure} />
          ))}
        </div>
      </details>
    </>
  );
}
