/**
 * Benchwire lab CLI: the measurement engine from a terminal.
 *
 *   npm run cli -- analyse <log file> [--vrm <col,col>] [--ambient <col>] [--clock <col>] [--power <col>]
 *                  [--time <col>] [--unit C|F|K|mV] [--cj <°C or col>] [--soak-min <n>]
 *                  [--load-start-min <n>] [--load-end-min <n>] [--confirm-dead <col,col>] [--json]
 *   npm run cli -- tc --mv <millivolts> [--cj <°C>] [--json]
 *   npm run cli -- tc --c <°C> [--cj <°C>] [--json]
 *
 * Exit status: 0 done, 1 the log or value was refused (the errors are printed), 2 wrong usage.
 */
import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { parseArgs } from 'node:util';
import type {
  AnalysisResult,
  ColumnMapping,
  LogPreview,
  ParseError,
  TemperatureUnit,
} from '../../shared/schemas/analysis';
import { analysisOptionsSchema, temperatureUnits } from '../../shared/schemas/analysis';
import { analyseLogFile, type ChosenMapping } from '../../shared/domain/analysis/analyse-log';
import { formatDuration } from '../../shared/domain/analysis/run-time-format';
import {
  ThermocoupleRangeError,
  typeKCelsiusWithColdJunction,
  typeKMeasuredMillivolts,
} from '../../shared/domain/analysis/type-k-thermocouple';

const usage = `Usage:
  npm run cli -- analyse <log file> [--vrm <col,col>] [--ambient <col>] [--clock <col>] [--power <col>]
                 [--time <col>] [--unit C|F|K|mV] [--cj <°C or col>] [--soak-min <n>]
                 [--load-start-min <n>] [--load-end-min <n>] [--confirm-dead <col,col>] [--json]
  npm run cli -- tc --mv <millivolts> [--cj <°C>] [--json]     type K millivolts → °C
  npm run cli -- tc --c <°C> [--cj <°C>] [--json]              °C → type K millivolts
Columns are header names or 1-based positions. Roles you leave out are guessed from the header and flagged.
--load-end-min sets where the load ended when the log runs on into a cool-down (else it is found from package power);
--confirm-dead names VRM columns with no reading at all that you confirm as dead probes, so the run is judged without them.`;

/** Options that take a value; kept in step with the options of readArguments. */
const valueOptions = [
  'vrm',
  'ambient',
  'clock',
  'power',
  'time',
  'unit',
  'cj',
  'soak-min',
  'load-start-min',
  'load-end-min',
  'confirm-dead',
  'mv',
  'c',
];

class UsageError extends Error {}

/** parseArgs refuses "--mv -1.2"; a negative number after a value option is that option's value. */
function joinNegativeValues(args: string[]): string[] {
  const joined: string[] = [];
  for (let i = 0; i < args.length; i++) {
    const name = args[i].replace(/^--/, '');
    const next = args[i + 1];
    if (args[i].startsWith('--') && valueOptions.includes(name) && /^-\d|^-\.\d/.test(next ?? '')) {
      joined.push(`${args[i]}=${next}`);
      i++;
    } else {
      joined.push(args[i]);
    }
  }
  return joined;
}

function readArguments(argv: string[]) {
  try {
    return parseArgs({
      args: joinNegativeValues(argv),
      allowPositionals: true,
      strict: true,
      options: {
        vrm: { type: 'string' },
        ambient: { type: 'string' },
        clock: { type: 'string' },
        power: { type: 'string' },
        time: { type: 'string' },
        unit: { type: 'string' },
        cj: { type: 'string' },
        'soak-min': { type: 'string' },
        'load-start-min': { type: 'string' },
        'load-end-min': { type: 'string' },
        'confirm-dead': { type: 'string' },
        mv: { type: 'string' },
        c: { type: 'string' },
        json: { type: 'boolean' },
        help: { type: 'boolean', short: 'h' },
      },
    });
  } catch (error) {
    throw new UsageError((error as Error).message);
  }
}

function numberOption(text: string | undefined, name: string): number | undefined {
  if (text === undefined) return undefined;
  const value = Number(text.replace(',', '.'));
  if (!Number.isFinite(value)) throw new UsageError(`--${name} needs a number, not "${text}".`);
  return value;
}

function minutesOption(text: string | undefined, name: string): number | undefined {
  const minutes = numberOption(text, name);
  return minutes === undefined ? undefined : minutes * 60;
}

function list(option: unknown): string[] | undefined {
  return typeof option === 'string'
    ? option
        .split(',')
        .map((name) => name.trim())
        .filter(Boolean)
    : undefined;
}

function printParseErrors(errors: ParseError[]): void {
  console.error(`The log could not be analysed (${errors.length} problem${errors.length === 1 ? '' : 's'}):`);
  for (const error of errors) console.error(`  [${error.code}] ${error.message}`);
}

const one = (value: number | null | undefined, digits = 1) =>
  value === null || value === undefined || !Number.isFinite(value) ? '—' : value.toFixed(digits);
const signedOne = (value: number | null) => (value === null ? '—' : `${value >= 0 ? '+' : ''}${value.toFixed(2)}`);

function printAnalysis(file: string, mapping: ColumnMapping, guessed: string[], analysis: AnalysisResult): void {
  const lines: string[] = [];
  const row = (label: string, text: string) => lines.push(`  ${label.padEnd(14)}${text}`);
  lines.push(`Benchwire analysis: ${basename(file)}`);
  row(
    'Mapping',
    [
      `VRM ${mapping.vrm.join(', ')}`,
      `ambient ${mapping.ambient ?? '—'}`,
      `clock ${mapping.clock ?? '—'}`,
      `power ${mapping.power ?? '—'}`,
    ].join(' · '),
  );
  if (guessed.length > 0) row('', `(guessed from the header: ${guessed.join(', ')}; confirm with --${guessed[0]})`);
  row(
    'Samples',
    `${analysis.sampleCount} at ${analysis.sampleRateHz.toFixed(2)} Hz, logged ${formatDuration(analysis.loggedS)}, ` +
      `load from ${formatDuration(analysis.loadStartS)}, soak ${formatDuration(analysis.soakS)} of ${formatDuration(analysis.requiredSoakS)} required`,
  );
  if (analysis.loadEndS !== null) {
    row(
      'Load end',
      `${formatDuration(analysis.loadEndS)} (${analysis.loadEndSource === 'manual' ? 'set by hand' : 'package power fell to idle'}); the cool-down tail after it is left out`,
    );
  }
  for (const note of analysis.readNotes) row('Time stamps', note);
  lines.push('');
  const header = ['Channel', 'Peak °C', 'at', 'Steady °C', 'Change', 'Steady', 'Gaps', 'Spikes'];
  const widths = [Math.max(12, ...analysis.channels.map((channel) => channel.column.length)) + 2, 9, 9, 11, 9, 8, 7, 7];
  const cell = (text: string, index: number) => (index === 0 ? text.padEnd(widths[0]) : text.padStart(widths[index]));
  lines.push(`  ${header.map(cell).join('')}`);
  for (const channel of analysis.channels) {
    const cells = [
      channel.column,
      one(channel.peakC),
      channel.peakAtS === null ? '—' : formatDuration(channel.peakAtS),
      one(channel.steadyStateMeanC),
      signedOne(channel.steadyStateChangeC),
      channel.reachedSteadyState ? 'yes' : 'no',
      String(channel.gapSamples),
      String(channel.spikeCount),
    ];
    lines.push(`  ${cells.map(cell).join('')}`);
  }
  lines.push('');
  const band =
    analysis.uncertainty.peakToleranceC === null
      ? `(${analysis.uncertainty.note})`
      : `± ${one(analysis.uncertainty.peakToleranceC)} °C (${analysis.uncertainty.standard})`;
  row('Peak', `${one(analysis.peakC)} °C ${band} on ${analysis.peakChannel} at ${formatDuration(analysis.peakAtS)}`);
  row(
    'Steady state',
    `${one(analysis.steadyStateMeanC)} °C, ${analysis.reachedSteadyState ? 'reached' : 'not reached'}`,
  );
  if (analysis.ambientMeanC === null) {
    row('Ambient', 'not logged');
  } else {
    row(
      'Ambient',
      `mean ${one(analysis.ambientMeanC)} °C (min ${one(analysis.ambientMinC)}, max ${one(analysis.ambientMaxC)}), ` +
        `drift ${signedOne(analysis.ambientDriftC)} °C, final window ${one(analysis.ambientFinalWindowMeanC)} °C`,
    );
    row(
      'Over ambient',
      `${one(analysis.deltaOverAmbientC)} °C; normalised to a ${one(analysis.referenceRoomC)} °C room: ${one(analysis.normalizedPeakC)} °C`,
    );
  }
  const prediction = analysis.prediction;
  row(
    'Prediction',
    prediction
      ? `τ ${formatDuration(prediction.tauS)}, steady state ${one(prediction.predictedSteadyC)} °C, soak ${(prediction.loadedS / prediction.tauS).toFixed(1)} τ ` +
          `(${prediction.soakAtLeastFiveTau ? 'at least' : 'short of'} 5 τ)`
      : (analysis.predictionNote ?? '—'),
  );
  const throttle = analysis.throttle;
  row(
    'Throttle',
    throttle.detected
      ? `from ${formatDuration(throttle.firstAtS ?? 0)} (${throttle.source})` +
          (throttle.shareThrottled === null ? '' : `, ${(throttle.shareThrottled * 100).toFixed(1)} % of the soak`)
      : throttle.source === 'none'
        ? 'no clock or power logged'
        : `none (${throttle.source})`,
  );
  const verdict = analysis.verdict;
  const judged =
    verdict.judgedC === null
      ? ''
      : ` (${verdict.basis} ${verdict.judgedFrom === 'predicted-steady-state' ? 'predicted steady state' : 'peak'} ${one(verdict.judgedC)} °C)`;
  row('Verdict', `${verdict.label}${judged}`);
  row('', verdict.rule);
  const effects = {
    withholds: 'withholds the verdict',
    'makes-provisional': 'makes it provisional',
    'read-with': 'read with it',
  };
  for (const concern of verdict.concerns) row('', `- ${concern.label}: ${effects[concern.effect]}`);
  if (analysis.flags.length > 0) {
    lines.push('', '  Flags');
    for (const flag of analysis.flags)
      lines.push(`    ${flag.severity === 'warning' ? '!' : 'i'} ${flag.label}: ${flag.message}`);
  }
  console.log(lines.join('\n'));
}

function analyseCommand(values: ReturnType<typeof readArguments>['values'], positionals: string[]): number {
  const file = positionals[1];
  if (!file) throw new UsageError('Name the log file to analyse.');
  const unit = values.unit;
  if (unit !== undefined && !(temperatureUnits as readonly string[]).includes(unit)) {
    throw new UsageError(`--unit is one of ${temperatureUnits.join(', ')}, not "${unit}".`);
  }
  const cjText = values.cj;
  const cjNumber = cjText === undefined ? undefined : Number(cjText.replace(',', '.'));
  const parsedOptions = analysisOptionsSchema.safeParse({
    unit: unit as TemperatureUnit | undefined,
    coldJunction:
      cjText === undefined ? undefined : Number.isFinite(cjNumber) ? { fixedC: cjNumber } : { column: cjText },
    soakMinutes: numberOption(values['soak-min'], 'soak-min'),
    loadStartS: minutesOption(values['load-start-min'], 'load-start-min'),
    loadEndS: minutesOption(values['load-end-min'], 'load-end-min'),
    confirmedDeadProbes: list(values['confirm-dead']),
  });
  if (!parsedOptions.success) {
    const issue = parsedOptions.error.issues[0];
    throw new UsageError(`Option ${issue.path.join('.')}: ${issue.message}`);
  }
  const options = parsedOptions.data;

  let bytes: Uint8Array;
  try {
    bytes = readFileSync(file);
  } catch (error) {
    console.error(`Cannot read ${file}: ${(error as Error).message}`);
    return 1;
  }
  // Roles named on the command line are used as given; the others are guessed from the header, and said so.
  const guessed: string[] = [];
  const chooseMapping = (preview: LogPreview): ChosenMapping => {
    const guess = preview.guessedMapping;
    const pick = (role: 'ambient' | 'clock' | 'power') => {
      const given = values[role];
      if (given !== undefined) return given;
      if (guess?.[role]) guessed.push(role);
      return guess?.[role] ?? null;
    };
    const vrm = list(values.vrm) ?? guess?.vrm;
    if (!values.vrm && vrm) guessed.unshift('vrm');
    if (!vrm || vrm.length === 0) return { mapping: null, guessed: false };
    const mapping: ColumnMapping = {
      ...(values.time ? { time: values.time } : {}),
      vrm,
      ambient: pick('ambient'),
      clock: pick('clock'),
      power: pick('power'),
    };
    return { mapping, guessed: guessed.length > 0 };
  };
  const outcome = analyseLogFile(bytes, { options }, { chooseMapping });
  if ('notText' in outcome) {
    console.error(`Cannot read ${file}: it is not a text export: save the log as CSV or TSV`);
    return 1;
  }
  if (!outcome.ok) {
    printParseErrors(outcome.errors);
    return 1;
  }
  const { analysis, mapping } = outcome;
  if (values.json) console.log(JSON.stringify(analysis, null, 2));
  else printAnalysis(file, mapping, guessed, analysis);
  return 0;
}

function thermocoupleCommand(values: ReturnType<typeof readArguments>['values']): number {
  const millivolts = numberOption(values.mv, 'mv');
  const celsius = numberOption(values.c, 'c');
  const junctionC = numberOption(values.cj, 'cj');
  if ((millivolts === undefined) === (celsius === undefined)) throw new UsageError('Give either --mv or --c.');
  try {
    if (millivolts !== undefined) {
      const result = typeKCelsiusWithColdJunction(millivolts, junctionC ?? 0);
      if (values.json) console.log(JSON.stringify({ celsius: result }));
      else
        console.log(
          `${millivolts} mV (cold junction ${junctionC ?? 0} °C) → ${result.toFixed(2)} °C (type K, NIST ITS-90)`,
        );
    } else {
      const result = typeKMeasuredMillivolts(celsius as number, junctionC ?? 0);
      if (values.json) console.log(JSON.stringify({ millivolts: result }));
      else
        console.log(
          `${celsius} °C (cold junction ${junctionC ?? 0} °C) → ${result.toFixed(3)} mV (type K, NIST ITS-90)`,
        );
    }
    return 0;
  } catch (error) {
    if (error instanceof ThermocoupleRangeError) {
      console.error(error.message);
      return 1;
    }
    throw error;
  }
}

function main(argv: string[]): number {
  try {
    const { values, positionals } = readArguments(argv);
    if (values.help || positionals.length === 0) {
      console.log(usage);
      return values.help ? 0 : 2;
    }
    if (positionals[0] === 'analyse') return analyseCommand(values, positionals);
    if (positionals[0] === 'tc') return thermocoupleCommand(values);
    throw new UsageError(`Unknown command "${positionals[0]}".`);
  } catch (error) {
    if (!(error instanceof UsageError)) throw error;
    console.error(`${error.message}\n\n${usage}`);
    return 2;
  }
}

process.exitCode = main(process.argv.slice(2));
