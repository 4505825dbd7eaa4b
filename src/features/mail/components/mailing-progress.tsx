import type { Mailing } from '../../../../shared/schemas/subscribers';

const parts: { key: keyof Mailing['counts']; label: string; className: string }[] = [
  { key: 'sent', label: 'sent', className: 'bg-teal' },
  { key: 'queued', label: 'queued', className: 'bg-slate' },
  { key: 'sending', label: 'sending', className: 'bg-copper' },
  { key: 'deferred', label: 'deferred', className: 'bg-amber' },
  { key: 'failed', label: 'failed', className: 'bg-red' },
  { key: 'suppressed', label: 'suppressed', className: 'bg-muted' },
];

const kindLabels: Record<Mailing['kind'], string> = {
  'go-live': 'Go-live',
  update: 'Update',
  correction: 'Correction',
};

/** One mailing's progress: a bar of its rows by state and the counts in words. */
export function MailingProgress({ mailing }: { mailing: Mailing }) {
  const { counts } = mailing;
  const done = counts.sent + counts.failed + counts.suppressed;
  return (
    <div className="space-y-1.5">
      <p className="text-sm font-medium text-ink">
        {kindLabels[mailing.kind]} mail · {done} of {counts.total} done
        {mailing.note ? <span className="font-normal text-muted"> — {mailing.note}</span> : null}
      </p>
      <div
        role="progressbar"
        aria-label={`${kindLabels[mailing.kind]} mail`}
        aria-valuemin={0}
        aria-valuemax={counts.total}
        aria-valuenow={done}
        className="flex h-3 w-full overflow-hidden rounded-[3px] border border-rule bg-wash"
      >
        {counts.total > 0 &&
          parts.map((part) =>
            counts[part.key] > 0 ? (
              <div
                key={part.key}
                className={part.className}
                style={{ width: `${(counts[part.key] / counts.total) * 100}%` }}
              />
            ) : null,
          )}
      </div>
      <p className="font-mono text-xs text-muted tabular-nums">
        {parts.map((part) => `${counts[part.key]} ${part.label}`).join(' · ')}
      </p>
    </div>
  );
}
