import { Alert } from '../../../components/ui/alert';
import { cx } from '../../../lib/class-names';
import { benchSafetyCaution } from '../../../lib/role-guide';

/** The standing safety note on every screen where bench work is planned (not announced: it is always there). */
export function BenchCautions({ className }: { className?: string }) {
  return (
    <Alert tone="caution" title="Before you work at a bench" className={cx(className)}>
      <ul className="mt-1 list-disc space-y-0.5 pl-4">
        {benchSafetyCaution.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
    </Alert>
  );
}
