import { Alert } from '../../../components/ui/alert';
import { benchSafetyCaution } from '../../../lib/role-guide';

/** The standing caution on every screen where testers plan bench work. */
export function BenchSafety({ className }: { className?: string }) {
  return (
    <Alert tone="caution" title="Bench safety" className={className}>
      <ul className="mt-1 list-disc space-y-0.5 pl-4">
        {benchSafetyCaution.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
    </Alert>
  );
}
