import { formatCsv } from '../lib/csv-export';
import type { PublishedRoundup } from './published-roundup';

/** Columns of a roundup's results CSV; units are in the names. */
export const resultsCsvColumns = [
  'roundup_id',
  'roundup_title',
  'board',
  'maker',
  'model',
  'entry_kind',
  'load_configuration',
  'package_power_w',
  'core_voltage_v',
  'required_soak_min',
  'run_id',
  'firmware',
  'source',
  'verdict',
  'verdict_status',
  'throttled',
  'peak_c',
  'ambient_c',
  'delta_over_ambient_c',
  'normalized_peak_c',
  'probe_tolerance_plus_minus_c',
  'tolerance_class',
  'soak_logged_min',
  'notes',
] as const;

/** Every run of record of a published roundup, one row per board and load configuration. */
export function resultsCsv(model: PublishedRoundup): string {
  const rows = model.results.map((result) => {
    const product = model.products.find((p) => p.entryId === result.entryId);
    const configuration = model.configurations.find((c) => c.id === result.configurationId);
    return [
      model.roundupId,
      model.title,
      product?.name ?? '',
      product?.maker ?? '',
      product?.model ?? '',
      product?.kind ?? '',
      configuration?.name ?? '',
      configuration?.packagePowerW ?? null,
      configuration?.coreVoltageV ?? null,
      configuration?.soakMinutes ?? null,
      result.runId,
      result.firmware,
      result.manual ? 'entered by hand' : 'logger file',
      result.verdict?.label ?? '',
      result.verdict?.status ?? '',
      result.throttled,
      result.peakC,
      result.ambientC,
      result.deltaOverAmbientC,
      result.normalizedPeakC,
      result.toleranceC,
      result.toleranceClass ?? '',
      result.soakMinutes,
      result.notes.join(' '),
    ];
  });
  return formatCsv(resultsCsvColumns, rows);
}

/** The analysis parameters of every run of record, the rubric and the test conditions, as one JSON document. */
export function analysisJson(model: PublishedRoundup, siteUrl: string) {
  return {
    roundup: {
      id: model.roundupId,
      title: model.title,
      url: `${siteUrl}${model.path}`,
      publishedAt: model.publishedAt,
    },
    licence: model.openData.licence,
    units: { temperature: '°C', power: 'W', voltage: 'V', time: 'min' },
    rubric: model.rubric,
    steadyStateRule: model.steadyStateRule,
    toleranceStandard: model.toleranceStandard,
    benchProfile: model.benchProfile,
    loadConfigurations: model.configurations,
    runs: model.results.map((result) => ({
      runId: result.runId,
      board: model.products.find((p) => p.entryId === result.entryId)?.name ?? null,
      loadConfigurationId: result.configurationId,
      engineVersion: result.analysis.engineVersion,
      parameters: result.analysis.parameters,
    })),
  };
}
