import { Badge, type BadgeTone } from '../../../components/ui/badge';
import { sectionReviewStateLabels, type SectionReviewState } from '../../../../shared/domain/editorial/section-states';

const tones: Record<SectionReviewState, BadgeTone> = {
  drafting: 'neutral',
  'with-editor': 'caution',
  'signed-off': 'positive',
};

export function SectionStateBadge({ state }: { state: SectionReviewState }) {
  return <Badge tone={tones[state]}>{sectionReviewStateLabels[state]}</Badge>;
}
