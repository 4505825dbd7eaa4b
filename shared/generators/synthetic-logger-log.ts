import type { TemperatureUnit } from '../schemas/analysis';
import { seededGaussian } from './seeded-random';
import { celsiusTo, temperatureUnitLabels } from '../domain/analysis/temperature-units';
import { typeKMeasuredMillivolts } from '../domain/analysis/type-k-thermocouple';

export interface SyntheticProbe {
  name: string;
  startC: number;
  /** ΔT∞ of the first-order rise after the load starts. */
  riseC: number;
  tauS: number;
  noiseC?: number;
  /** Single-sample spikes added at the sample nearest `atS`. */
  spikes?: { atS: number; deltaC: number }[];
  /** Samples written as an error marker. */
  dropouts?: { fromS: number; toS: number; marker?: string }[];
}

export interface SyntheticStep {
  fromS: number;
  toS?: number;
  value: number;
}

/**
 * A logger export with known answers, for tests, the benchmark and demo data: first-order rises starting at the load
 * start, ambient with a linear drift, a clock or package power that can drop at a known time, missing rows, and the
 * formatting choices real loggers make (delimiter, decimal comma, time format, unit, preamble).
 */
export interface SyntheticLogSpec {
  durationS: number;
  sampleHz: number;
  seed?: number;
  loadStartS?: number;
  /**
   * The load stops here and the log runs on: probes cool first-order back toward their start with their own τ, package
   * power falls to its idle level and the clock to its idle clock (a cool-down tail).
   */
  loadEndS?: number;
  probes: SyntheticProbe[];
  ambient?: { name: string; startC: number; driftC?: number; noiseC?: number } | null;
  clock?: { name: string; mhz: number; idleMhz?: number; noiseMhz?: number; drop?: SyntheticStep } | null;
  power?: { name: string; watts: number; idleWatts?: number; noiseW?: number; drop?: SyntheticStep } | null;
  extraChannels?: { name: string; value: number; noise?: number }[];
  /** Rows left out, leaving gaps in the time column. */
  missingRows?: { fromS: number; toS: number }[];
  delimiter?: ',' | ';' | '\t';
  decimalComma?: boolean;
  time?: 'seconds' | 'clock' | 'iso';
  startIso?: string;
  /** Unit of the probe and ambient columns, named in their headers. */
  unit?: TemperatureUnit;
  coldJunctionC?: number;
  preamble?: string[];
  decimals?: number;
}

function within(t: number, range: { fromS: number; toS?: number }): boolean {
  return t >= range.fromS && (range.toS === undefined || t < range.toS);
}

function clockText(t: number): string {
  const hours = Math.floor(t / 3600);
  const minutes = Math.floor((t % 3600) / 60);
  const seconds = t % 60;
  const pad = (value: number) => String(value).padStart(2, '0');
  const secondText = Number.isInteger(seconds) ? pad(seconds) : seconds.toFixed(1).padStart(4, '0');
  return `${pad(hours)}:${pad(minutes)}:${secondText}`;
}

/** The temperature of a probe at t, without noise: a first-order rise from the load start, a first-order fall after its end. */
export function syntheticProbeC(probe: SyntheticProbe, t: number, loadStartS = 0, loadEndS = Infinity): number {
  if (t < loadStartS) return probe.startC;
  const rise = (s: number) => probe.riseC * (1 - Math.exp(-(s - loadStartS) / probe.tauS));
  if (t < loadEndS) return probe.startC + rise(t);
  return probe.startC + rise(loadEndS) * Math.exp(-(t - loadEndS) / probe.tauS);
}

export function syntheticLoggerLog(spec: SyntheticLogSpec): string {
  const gaussian = seededGaussian(spec.seed ?? 1);
  const delimiter = spec.delimiter ?? ',';
  const decimals = spec.decimals ?? 2;
  const unit = spec.unit ?? 'C';
  const loadStartS = spec.loadStartS ?? 0;
  const junctionC = spec.coldJunctionC ?? 25;
  const startMs = Date.parse(spec.startIso ?? '2025-03-01T09:00:00Z');
  const number = (value: number, places = decimals) => {
    const text = value.toFixed(places);
    return spec.decimalComma ? text.replace('.', ',') : text;
  };
  const temperature = (celsius: number) =>
    unit === 'mV' ? number(typeKMeasuredMillivolts(celsius, junctionC), 3) : number(celsiusTo(celsius, unit));
  const unitLabel = `[${temperatureUnitLabels[unit]}]`;

  const header = [spec.time === 'iso' ? 'Timestamp' : spec.time === 'clock' ? 'Time' : 'Time [s]'];
  for (const probe of spec.probes) header.push(`${probe.name} ${unitLabel}`);
  if (spec.ambient) header.push(`${spec.ambient.name} ${unitLabel}`);
  if (spec.clock) header.push(spec.clock.name);
  if (spec.power) header.push(spec.power.name);
  for (const extra of spec.extraChannels ?? []) header.push(extra.name);

  const lines = [...(spec.preamble ?? []), header.join(delimiter)];
  const samples = Math.round(spec.durationS * spec.sampleHz);
  for (let i = 0; i < samples; i++) {
    const t = i / spec.sampleHz;
    if (spec.missingRows?.some((range) => within(t, range))) continue;
    const cells: string[] = [];
    if (spec.time === 'iso') cells.push(new Date(startMs + t * 1000).toISOString());
    else if (spec.time === 'clock') cells.push(clockText(t));
    else cells.push(spec.decimalComma ? String(t).replace('.', ',') : String(t));
    for (const probe of spec.probes) {
      const dropout = probe.dropouts?.find((range) => within(t, range));
      if (dropout) {
        cells.push(dropout.marker ?? 'OPEN');
        continue;
      }
      let celsius = syntheticProbeC(probe, t, loadStartS, spec.loadEndS) + (probe.noiseC ?? 0) * gaussian();
      for (const spike of probe.spikes ?? []) {
        if (Math.abs(t - spike.atS) < 0.5 / spec.sampleHz) celsius += spike.deltaC;
      }
      cells.push(temperature(celsius));
    }
    if (spec.ambient) {
      const { startC, driftC = 0, noiseC = 0 } = spec.ambient;
      cells.push(temperature(startC + (driftC * t) / spec.durationS + noiseC * gaussian()));
    }
    if (spec.clock) {
      const { mhz, idleMhz = mhz, noiseMhz = 0, drop } = spec.clock;
      const idle = t < loadStartS || (spec.loadEndS !== undefined && t >= spec.loadEndS);
      const value = idle ? idleMhz : drop && within(t, drop) ? drop.value : mhz;
      cells.push(String(Math.round(value + noiseMhz * gaussian())));
    }
    if (spec.power) {
      const { watts, idleWatts = watts, noiseW = 0, drop } = spec.power;
      const idle = t < loadStartS || (spec.loadEndS !== undefined && t >= spec.loadEndS);
      const base = idle ? idleWatts : drop && within(t, drop) ? drop.value : watts;
      cells.push(number(base + noiseW * gaussian(), 1));
    }
    for (const extra of spec.extraChannels ?? []) cells.push(number(extra.value + (extra.noise ?? 0) * gaussian()));
    lines.push(cells.join(delimiter));
  }
  return `${lines.join('\n')}\n`;
}
