import type { QaFlagCode } from '../../schemas/analysis';

/**
 * Each QA flag in words, for people: the screen, the verdict box and the CLI's text output use these, and the API
 * sends them with every flag. Codes are for programs only.
 */
export const qaFlagLabels: Record<QaFlagCode, string> = {
  'ambient-out-of-range': 'Room outside its target',
  'ambient-drift': 'Room temperature drifted',
  'ambient-missing': 'No room reading',
  'soak-too-short': 'Soak shorter than required',
  'not-steady': 'Not settled',
  'short-of-five-tau': 'Soak under five time constants',
  gaps: 'Missing samples',
  'probe-dropout': 'Probe dropouts',
  'probe-dead': 'Dead probe',
  'probe-spike': 'Spikes ignored',
  'manual-entry': 'Entered by hand',
  'mapping-guessed': 'Column mapping guessed',
  'calibration-overdue': 'Instrument past calibration',
};
