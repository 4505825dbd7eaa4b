import { analysisOptionsSchema } from '../../../../shared/schemas/analysis';

/** The schema's own defaults, so the form never carries numbers of its own. */
export const defaultOptions = analysisOptionsSchema.parse({});
type Options = typeof defaultOptions;

/**
 * One number the tester may set for the analysis. The draft, the request, the error messages and the form all follow
 * this list: a new option is one more entry here (and its schema field in shared/schemas/analysis.ts).
 */
export interface OptionFigure {
  /** The draft's field, holding the text as typed. */
  name: string;
  label: string;
  unit: string;
  /** Where the number goes in the request's options, e.g. ['rubric', 'warmUpToC']. */
  path: readonly string[];
  /** The text the form starts with, where it is not simply the number at `path` (empty when that is unset). */
  initial?: (defaults: Options) => string;
  /** The typed number as the request wants it (a share typed in percent, minutes sent as seconds). */
  toRequest?: (typed: number) => number;
  /** Empty means "not set" (sent as null) rather than "enter a number". */
  optional?: boolean;
  /** Shown when the schema's range check refuses the number. */
  rangeMessage: string;
  /** 'main' sits in the options grid; 'limits' in the folded "Throttle rule and verdict limits". */
  group: 'main' | 'limits';
  description?: string;
  /** Why the option does not apply to this mapping (then it is disabled and sent as null), or null when it does. */
  inapplicable?: (mapping: { clock: string }) => string | null;
}

export const optionFigures = [
  {
    name: 'soakMinutes',
    label: 'Required soak',
    unit: 'min',
    path: ['soakMinutes'],
    rangeMessage: 'Enter more than 0 and at most 1440 minutes.',
    group: 'main',
    description: `Default ${defaultOptions.soakMinutes} min per load.`,
  },
  {
    name: 'ambientTargetC',
    label: 'Room target',
    unit: '°C',
    path: ['ambientTargetC'],
    rangeMessage: 'Enter a room target from −20 to 60 °C.',
    group: 'main',
  },
  {
    name: 'ambientToleranceC',
    label: 'Room tolerance (±)',
    unit: '°C',
    path: ['ambientToleranceC'],
    rangeMessage: 'Enter a tolerance from 0 to 20 °C.',
    group: 'main',
  },
  {
    name: 'ambientDriftLimitC',
    label: 'Largest room drift',
    unit: '°C',
    path: ['ambientDriftLimitC'],
    rangeMessage: 'Enter a drift limit from 0 to 20 °C.',
    group: 'main',
    description: 'Over the whole run.',
  },
  {
    name: 'manualThrottleMinute',
    label: 'Throttled at minute',
    unit: 'min',
    path: ['manualThrottleMinute'],
    optional: true,
    rangeMessage: 'Enter a minute of 0 or more, or leave it empty.',
    group: 'main',
    description: 'Only when no clock is logged: the minute you saw the CPU throttle. Leave empty if it did not.',
    inapplicable: (mapping) => (mapping.clock ? 'A clock column is mapped: throttling is detected from it.' : null),
  },
  {
    name: 'loadEndMinute',
    label: 'Load ended at minute',
    unit: 'min',
    path: ['loadEndS'],
    toRequest: (minutes) => minutes * 60,
    optional: true,
    rangeMessage: 'Enter the minute the load stopped, after it started, or leave it empty.',
    group: 'main',
    description:
      'Only when the log runs on after the load: later samples are a cool-down, left out. Empty: found from package power.',
  },
  {
    name: 'throttlePercent',
    label: 'Throttle threshold',
    unit: '%',
    path: ['throttleFraction'],
    initial: (d) => String(Math.round(d.throttleFraction * 100)),
    toRequest: (percent) => percent / 100,
    rangeMessage: 'Enter a share above 0 and below 100 %.',
    group: 'limits',
    description: 'Throttled below this share of the loaded median clock.',
  },
  {
    name: 'throttleMinSeconds',
    label: 'Throttle lasts at least',
    unit: 's',
    path: ['throttleMinSeconds'],
    rangeMessage: 'Enter more than 0 and at most 3600 seconds.',
    group: 'limits',
  },
  {
    name: 'comfortableBelowC',
    label: 'Comfortable below',
    unit: '°C',
    path: ['rubric', 'comfortableBelowC'],
    rangeMessage: 'Enter a limit from 0 to 200 °C.',
    group: 'limits',
  },
  {
    name: 'warmUpToC',
    label: 'Warm up to',
    unit: '°C',
    path: ['rubric', 'warmUpToC'],
    rangeMessage: 'Enter a limit from 0 to 250 °C.',
    group: 'limits',
    description: 'Above it, a run that held its clock is Hot but held.',
  },
] as const satisfies readonly OptionFigure[];

/** The text a figure's field starts with, from the given options (the schema's defaults unless told). */
export function initialText(figure: OptionFigure, options: Options = defaultOptions): string {
  if (figure.initial) return figure.initial(options);
  const value = figure.path.reduce<unknown>((at, key) => (at as Record<string, unknown>)[key], options);
  return value === null || value === undefined ? '' : String(value);
}

export type OptionFigureName = (typeof optionFigures)[number]['name'];
