import { Badge, type BadgeTone } from './badge';
import { roundupStateLabels, type RoundupState } from '../../../shared/domain/planning/roundup-states';

// Early states read neutral, bench work in the accent, editorial steps amber, published teal: the label always
// says the state, the colour only groups.
const tones: Record<RoundupState, BadgeTone> = {
  planning: 'neutral',
  'on-the-bench': 'accent',
  writing: 'caution',
  'in-review': 'caution',
  scheduled: 'positive',
  live: 'positive',
  updated: 'positive',
};

export function RoundupStateBadge({ state }: { state: RoundupState }) {
  return <Badge tone={tones[state]}>{roundupStateLabels[state]}</Badge>;
}
