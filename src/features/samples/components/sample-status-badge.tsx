import { Badge, type BadgeTone } from '../../../components/ui/badge';
import { sampleStatusLabels, type SampleStatus } from '../../../../shared/schemas/samples';

const tones: Record<SampleStatus, BadgeTone> = {
  ordered: 'muted',
  received: 'neutral',
  'on-the-bench': 'accent',
  tested: 'positive',
  returned: 'neutral',
  kept: 'neutral',
};

export function SampleStatusBadge({ status }: { status: SampleStatus }) {
  return <Badge tone={tones[status]}>{sampleStatusLabels[status]}</Badge>;
}
