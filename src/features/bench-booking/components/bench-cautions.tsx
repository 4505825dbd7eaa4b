import { Alert } from '../../../components/ui/alert';
import { benchSafetyCaution } from '../../../lib/role-guide';

/** The standing safety note for work at the bench (not announced: it is always there). */
export function BenchCautions() {
  return (
    <Alert tone="caution" title="Before you work at a bench" className="mb-5">
      <ul className="mt-1 list-disc space-y-0.5 pl-4">
        {benchSafetyCaution.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
    </Alert>
  );
}
