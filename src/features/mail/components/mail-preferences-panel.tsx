import { Alert } from '../../../components/ui/alert';
import { Panel } from '../../../components/ui/panel';
import { useMailPreferences, useUpdateMailPreferences } from '../api/subscribers';

/** Account: which reminder mails this person receives; each kind can be turned off. */
export function MailPreferencesPanel({ className }: { className?: string }) {
  const preferences = useMailPreferences();
  const update = useUpdateMailPreferences();
  const kinds = preferences.data?.kinds ?? [];
  return (
    <Panel
      title="Reminder mail"
      description="Mail Benchwire sends you about your work. Changes save at once."
      className={className}
    >
      {preferences.isError && <Alert tone="danger">{preferences.error.message}</Alert>}
      <ul className="space-y-2">
        {kinds.map((entry) => (
          <li key={entry.kind}>
            <label className="flex items-center gap-2.5 text-sm text-ink">
              <input
                type="checkbox"
                className="size-4.5 accent-copper"
                checked={entry.enabled}
                disabled={update.isPending}
                onChange={(event) =>
                  update.mutate(
                    kinds
                      .filter((k) => (k.kind === entry.kind ? !event.target.checked : !k.enabled))
                      .map((k) => k.kind),
                  )
                }
              />
              {entry.label}
            </label>
          </li>
        ))}
      </ul>
      {update.isError && (
        <Alert tone="danger" announce className="mt-3">
          {update.error.message}
        </Alert>
      )}
    </Panel>
  );
}
