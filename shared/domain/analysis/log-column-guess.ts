import type { ColumnMapping, ColumnRole, TemperatureUnit } from '../../schemas/analysis';
import { timeHeaderPattern } from './log-time-value';

const coldJunctionPattern = /\b(?:cj|cjc|cold[\s_-]*junction|ref(?:erence)?[\s_-]*junction|terminal|internal)\b/i;
const ambientPattern = /ambient|\bamb\b|\broom\b|\bair\b|intake|environment|\benv\b/i;
const clockPattern = /clock|\bclk\b|freq|\bmhz\b|\bghz\b|core[\s_-]*speed|effective[\s_-]*speed/i;
const vrmPattern =
  /vrm|\bvr\b|\bmos\b|mosfet|power[\s_-]*stage|\bstages?\b|\bphases?\b|choke|inductor|\bvcore\b|\bvsoc\b|heatsink|\bpcb\b|backplate|board[\s_-]*rear/i;
const powerPattern = /power|\bpkg\b|package|\bwatts?\b|[([]\s*w\s*[)\]]|\bppt\b/i;
const genericTemperaturePattern = /\b(?:ch|tc|t|probe|temp|temperature|sensor)[\s_-]*\d*\b|^\d+$/i;

const unitPatterns: [RegExp, TemperatureUnit][] = [
  [/\bmv\b|[([]\s*mv\s*[)\]]/i, 'mV'],
  [/°\s*f\b|\bdeg\s*f\b|[([]\s*f\s*[)\]]|fahrenheit/i, 'F'],
  [/°\s*c\b|\bdeg\s*c\b|[([]\s*c\s*[)\]]|celsius/i, 'C'],
  [/[([]\s*k\s*[)\]]|kelvin/i, 'K'],
];

/** Unit named in a header ("VRM 1 [°C]", "TC2 (mV)", "Ambient degF"), null when none. */
export function unitFromColumnName(name: string): TemperatureUnit | null {
  for (const [pattern, unit] of unitPatterns) if (pattern.test(name)) return unit;
  return null;
}

/** Role suggested by a header name alone; the tester confirms it. */
export function guessColumnRole(name: string): ColumnRole {
  if (timeHeaderPattern.test(name)) return 'time';
  if (coldJunctionPattern.test(name)) return 'cold-junction';
  if (ambientPattern.test(name)) return 'ambient';
  if (clockPattern.test(name)) return 'clock';
  if (vrmPattern.test(name)) return 'vrm';
  if (powerPattern.test(name)) return 'power';
  return 'other';
}

function looksLikeTemperatureChannel(name: string): boolean {
  return unitFromColumnName(name) !== null || genericTemperaturePattern.test(name);
}

/**
 * Best guess from header names: VRM columns by name, else the generic temperature channels (CH1, TC2, Probe 3, a
 * column with a temperature unit) that have no other role. Null when no VRM column can be guessed.
 */
export function guessColumnMapping(names: readonly string[], timeColumn: string | null): ColumnMapping | null {
  const roles = names.map((name) => (name === timeColumn ? 'time' : guessColumnRole(name)));
  const first = (role: ColumnRole) => names.find((_, index) => roles[index] === role) ?? null;
  let vrm = names.filter((_, index) => roles[index] === 'vrm');
  if (vrm.length === 0) {
    vrm = names.filter((name, index) => roles[index] === 'other' && looksLikeTemperatureChannel(name));
  }
  if (vrm.length === 0) return null;
  return {
    ...(timeColumn ? { time: timeColumn } : {}),
    vrm,
    ambient: first('ambient'),
    clock: first('clock'),
    power: first('power'),
  };
}
