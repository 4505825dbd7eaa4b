import {
  analysisOptionsSchema,
  analysisRequestSchema,
  type AnalysisRequestInput,
  type ColumnMapping,
  type ColumnRole,
  type LogPreview,
  type PreviewColumn,
  type TemperatureUnit,
  type ToleranceClass,
} from '../../../../shared/schemas/analysis';
import { defaultOptions, initialText, optionFigures, type OptionFigure, type OptionFigureName } from './option-figures';

/**
 * What the tester has chosen in the mapping form, as the form holds it (numbers as typed). It survives every failed
 * request, and a second file with the same header keeps it.
 */
export interface MappingDraft extends Record<OptionFigureName, string> {
  time: string;
  vrm: string[];
  ambient: string;
  clock: string;
  power: string;
  /** Only the units the tester set; other columns use the unit their header names, else °C. */
  units: Record<string, TemperatureUnit>;
  coldJunction: 'none' | 'fixed' | 'column';
  coldJunctionFixedC: string;
  coldJunctionColumn: string;
  toleranceClass: ToleranceClass;
  useNormalizedPeak: boolean;
  testerMarkedUnstable: boolean;
  /** VRM columns with no reading that the tester confirmed as dead probes (from the result's verdict box). */
  confirmedDeadProbes: string[];
}

export type DraftField = Exclude<keyof MappingDraft, 'units'> | `unit:${string}`;

const figures: readonly OptionFigure[] = optionFigures;

export const roleLabels: Record<ColumnRole, string> = {
  time: 'Time',
  vrm: 'VRM probe',
  ambient: 'Ambient',
  clock: 'Clock (MHz)',
  power: 'Package power (W)',
  'cold-junction': 'Cold junction',
  other: 'Not used',
};

function optionFields(): Omit<MappingDraft, 'time' | 'vrm' | 'ambient' | 'clock' | 'power' | 'units'> {
  const typed = Object.fromEntries(figures.map((figure) => [figure.name, initialText(figure)]));
  return {
    ...(typed as Record<OptionFigureName, string>),
    coldJunction: 'none',
    coldJunctionFixedC: '',
    coldJunctionColumn: '',
    toleranceClass: defaultOptions.toleranceClass,
    useNormalizedPeak: defaultOptions.useNormalizedPeak,
    testerMarkedUnstable: defaultOptions.testerMarkedUnstable,
    confirmedDeadProbes: [],
  };
}

/**
 * The role the server's guess gives a column: its guessed mapping first (which also takes generic channels such as
 * "CH1" as VRM probes), else the role read from the column's name alone.
 */
export function guessedRoleOf(preview: LogPreview, column: PreviewColumn): ColumnRole {
  const mapping = preview.guessedMapping;
  if (mapping) {
    if (mapping.time === column.name) return 'time';
    if (mapping.vrm.includes(column.name)) return 'vrm';
    if (mapping.ambient === column.name) return 'ambient';
    if (mapping.clock === column.name) return 'clock';
    if (mapping.power === column.name) return 'power';
  }
  return column.guessedRole;
}

/** The unit a column is read in: the tester's choice, else its header's, else °C. */
export function unitOf(draft: MappingDraft, preview: LogPreview, column: string): TemperatureUnit {
  return draft.units[column] ?? preview.columns.find((entry) => entry.name === column)?.guessedUnit ?? 'C';
}

/** Columns read as temperatures under the draft, in header order. */
export function temperatureColumns(draft: MappingDraft, preview: LogPreview): string[] {
  const chosen = new Set([...draft.vrm, draft.ambient]);
  if (draft.coldJunction === 'column') chosen.add(draft.coldJunctionColumn);
  return preview.columns.map((column) => column.name).filter((name) => name && chosen.has(name));
}

/**
 * The mapping the server guessed from the header, as a draft. Options the tester already set are kept, and so is the
 * whole mapping when the new file has the same columns as the last one.
 */
export function draftFromPreview(
  preview: LogPreview,
  previous: { draft: MappingDraft; preview: LogPreview } | null,
): MappingDraft {
  const names = preview.columns.map((column) => column.name);
  if (previous && previous.preview.columns.map((column) => column.name).join('\u0000') === names.join('\u0000')) {
    return previous.draft;
  }
  const guessed = preview.guessedMapping;
  const junctionColumn = preview.columns.find((column) => column.guessedRole === 'cold-junction')?.name ?? '';
  const draft: MappingDraft = {
    ...(previous ? previous.draft : optionFields()),
    time: guessed?.time ?? preview.timeColumn ?? '',
    vrm: guessed?.vrm ?? [],
    ambient: guessed?.ambient ?? '',
    clock: guessed?.clock ?? '',
    power: guessed?.power ?? '',
    units: {},
    confirmedDeadProbes: [],
    coldJunction: 'none',
    coldJunctionColumn: junctionColumn,
  };
  const millivolts = temperatureColumns(draft, preview).some((column) => unitOf(draft, preview, column) === 'mV');
  if (millivolts) draft.coldJunction = junctionColumn ? 'column' : 'fixed';
  return draft;
}

export type DraftErrors = Partial<Record<DraftField, string>>;

const fieldByIssuePath: Record<string, DraftField> = {
  'mapping.time': 'time',
  'mapping.vrm': 'vrm',
  'mapping.ambient': 'ambient',
  'mapping.clock': 'clock',
  'mapping.power': 'power',
  'options.coldJunction.fixedC': 'coldJunctionFixedC',
  'options.coldJunction.column': 'coldJunctionColumn',
  'options.toleranceClass': 'toleranceClass',
  ...Object.fromEntries(figures.map((figure) => [['options', ...figure.path].join('.'), figure.name as DraftField])),
};

/** Plain words for the schema's range checks, which read technical (as useZodForm's `messages` do elsewhere). */
const rangeMessages: Partial<Record<DraftField, string>> = {
  coldJunctionFixedC: 'Enter a temperature from −50 to 150 °C.',
  ...Object.fromEntries(figures.map((figure) => [figure.name, figure.rangeMessage])),
};

/** Puts a value at a path of nested objects, making the objects on the way. */
function setAt(target: Record<string, unknown>, path: readonly string[], value: unknown) {
  let node = target;
  for (const key of path.slice(0, -1)) {
    node[key] ??= {};
    node = node[key] as Record<string, unknown>;
  }
  node[path[path.length - 1]] = value;
}

function readNumber(text: string): number | null {
  const trimmed = text.trim().replace(',', '.');
  if (trimmed === '') return null;
  const value = Number(trimmed);
  return Number.isFinite(value) ? value : Number.NaN;
}

/**
 * Turns the draft into the request the server validates, checked with the same shared schema first; field problems
 * come back keyed by form field.
 */
export function requestFromDraft(
  draft: MappingDraft,
  preview: LogPreview,
): { request: AnalysisRequestInput; errors: null } | { request: null; errors: DraftErrors } {
  const errors: DraftErrors = {};
  const number = (field: DraftField, text: string, required = true): number | null => {
    const value = readNumber(text);
    if (value === null) {
      if (required) errors[field] = 'Enter a number.';
      return null;
    }
    if (Number.isNaN(value)) {
      errors[field] = 'Enter a number, such as 21.5.';
      return null;
    }
    return value;
  };

  if (!draft.time) errors.time = 'Choose the time column.';
  if (draft.vrm.includes(draft.time)) errors.vrm = 'The time column cannot also be a VRM probe.';
  for (const role of ['ambient', 'clock', 'power'] as const) {
    if (draft[role] && (draft[role] === draft.time || draft.vrm.includes(draft[role]))) {
      errors[role] = 'This column already has another role.';
    }
  }

  const units: Record<string, TemperatureUnit> = {};
  for (const column of temperatureColumns(draft, preview)) units[column] = unitOf(draft, preview, column);
  const millivolts = Object.entries(units).some(
    ([column, unit]) => unit === 'mV' && column !== draft.coldJunctionColumn,
  );

  let coldJunction: { fixedC: number } | { column: string } | undefined;
  if (draft.coldJunction === 'fixed') {
    const fixedC = number('coldJunctionFixedC', draft.coldJunctionFixedC);
    if (fixedC !== null) coldJunction = { fixedC };
  } else if (draft.coldJunction === 'column') {
    if (!draft.coldJunctionColumn) errors.coldJunctionColumn = 'Choose the cold-junction column.';
    else coldJunction = { column: draft.coldJunctionColumn };
  } else if (millivolts) {
    errors.coldJunction = 'Millivolt channels need a cold junction: a fixed temperature or a logged column.';
  }

  const options: Record<string, unknown> = {
    ...(coldJunction ? { coldJunction } : {}),
    toleranceClass: draft.toleranceClass,
    useNormalizedPeak: draft.useNormalizedPeak,
    testerMarkedUnstable: draft.testerMarkedUnstable,
    confirmedDeadProbes: draft.confirmedDeadProbes.filter((column) => draft.vrm.includes(column)),
  };
  for (const figure of figures) {
    const name = figure.name as OptionFigureName;
    if (figure.inapplicable?.(draft)) {
      setAt(options, figure.path, null);
      continue;
    }
    const typed = number(name, draft[name], !figure.optional);
    // Unset required figures are left out (the schema's default would apply, but the error above stops the request).
    if (typed !== null) setAt(options, figure.path, figure.toRequest ? figure.toRequest(typed) : typed);
    else if (figure.optional) setAt(options, figure.path, null);
  }

  const request: AnalysisRequestInput = {
    mapping: {
      time: draft.time || undefined,
      vrm: draft.vrm,
      ambient: draft.ambient || null,
      clock: draft.clock || null,
      power: draft.power || null,
      units,
    },
    options: options as AnalysisRequestInput['options'],
  };

  const checked = analysisRequestSchema.safeParse(request);
  if (!checked.success) {
    for (const issue of checked.error.issues) {
      const field = fieldByIssuePath[issue.path.map(String).join('.')];
      if (field && !errors[field]) {
        const friendly = issue.code === 'too_small' || issue.code === 'too_big' ? rangeMessages[field] : undefined;
        errors[field] = friendly ?? issue.message;
      }
    }
    if (Object.keys(errors).length === 0) errors.time = checked.error.issues[0]?.message ?? 'Check the mapping.';
  }
  if (Object.keys(errors).length > 0) return { request: null, errors };
  return { request, errors: null };
}

/**
 * A mapping (and the options) used before — a bench profile's remembered mapping, a stored run's analysis — as a
 * draft of this file, when every column it names is in the file; null when the file does not have them all.
 * Options the form holds as typed numbers are taken from `options` where it gives them (the optional ones stay).
 */
export function draftFromStoredRequest(
  draft: MappingDraft,
  names: readonly string[],
  mapping: ColumnMapping,
  options?: unknown,
): MappingDraft | null {
  const used = [mapping.time, ...mapping.vrm, mapping.ambient, mapping.clock, mapping.power].filter(
    (name): name is string => typeof name === 'string' && name.length > 0,
  );
  if (!used.every((name) => names.includes(name))) return null;
  const next: MappingDraft = {
    ...draft,
    time: mapping.time ?? draft.time,
    vrm: [...mapping.vrm],
    ambient: mapping.ambient ?? '',
    clock: mapping.clock ?? '',
    power: mapping.power ?? '',
    units: { ...(mapping.units ?? {}) },
  };
  const stored = options === undefined ? null : analysisOptionsSchema.safeParse(options);
  if (stored?.success) {
    for (const figure of figures) {
      if (!figure.optional) next[figure.name as OptionFigureName] = initialText(figure, stored.data);
    }
    next.toleranceClass = stored.data.toleranceClass;
    next.useNormalizedPeak = stored.data.useNormalizedPeak;
    next.testerMarkedUnstable = stored.data.testerMarkedUnstable;
  }
  return next;
}
