import type { VerdictCode, VerdictStatus } from '../../schemas/analysis';
import type { LoadSettingsMode } from '../../schemas/load-configurations';
import { editorialLabelNames, recommendingLabels, type EditorialLabel } from './editorial-labels';

/** What the measurements say about one product under one load configuration: its run of record's verdict. */
export interface VerdictEvidence {
  loadConfigurationName: string;
  /** Stock settings, or a fixed clock and voltage (an overclocking load). */
  settingsMode: LoadSettingsMode;
  /** False when the cell has no run of record yet. */
  hasRunOfRecord: boolean;
  verdictCode: VerdictCode | null;
  verdictStatus: VerdictStatus | null;
  throttled: boolean;
}

/**
 * Where an editor's label goes against the rubric verdicts of the product's runs of record; each entry is a sentence
 * for the editor. An empty list means the label agrees with the evidence; otherwise the label stands only with a
 * written reason.
 *
 * - Bench pick and Recommended claim the board is good for stock and overclocked use: any run of record that
 *   throttled, any verdict that is withheld or only provisional (or a missing run of record), and Hot but held under
 *   an overclocking (fixed clock and voltage) load contradict them.
 * - Fine at stock claims the board holds at stock settings: a stock load that throttled, or whose verdict is withheld
 *   or missing, contradicts it.
 * - Skip for overclocking is a warning and contradicts no measurement.
 */
export function verdictContradictions(label: EditorialLabel, evidence: readonly VerdictEvidence[]): string[] {
  const name = editorialLabelNames[label];
  const problems: string[] = [];
  const recommending = recommendingLabels.includes(label);
  if (!recommending && label !== 'fine-at-stock') return problems;
  const relevant = recommending ? evidence : evidence.filter((e) => e.settingsMode === 'stock');
  for (const e of relevant) {
    const under = `under “${e.loadConfigurationName}”`;
    if (!e.hasRunOfRecord) {
      problems.push(`${name} claims more than the evidence: there is no run of record ${under}.`);
    } else if (e.throttled || e.verdictCode === 'throttled') {
      problems.push(`${name} contradicts the run of record ${under}: it throttled.`);
    } else if (e.verdictStatus === 'withheld' || e.verdictCode === null) {
      problems.push(`${name} claims more than the evidence: the verdict ${under} is withheld.`);
    } else if (recommending && e.verdictStatus === 'provisional') {
      problems.push(`${name} claims more than the evidence: the verdict ${under} is only provisional.`);
    } else if (recommending && e.verdictCode === 'hot-but-held' && e.settingsMode === 'fixed') {
      problems.push(`${name} contradicts the run of record ${under}: it was hot but held at an overclocking load.`);
    }
  }
  return problems;
}
