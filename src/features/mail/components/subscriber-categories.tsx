import { useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Panel } from '../../../components/ui/panel';
import { TextField } from '../../../components/ui/text-field';
import { isApiError } from '../../../lib/api-client';
import { useDeleteCategory, useSaveCategory, useSubscriberCategories } from '../api/subscribers';

interface Draft {
  id: number | null;
  name: string;
  description: string;
  matchProductClass: string;
  matchPlatform: string;
}

const emptyDraft: Draft = { id: null, name: '', description: '', matchProductClass: '', matchPlatform: '' };

/** The subject's text fields, in the order the form shows them; only the name is required. */
const draftFields: {
  name: Exclude<keyof Draft, 'id'>;
  label: string;
  description?: string;
  optional?: boolean;
}[] = [
  { name: 'name', label: 'Name' },
  { name: 'description', label: 'Description', optional: true },
  {
    name: 'matchProductClass',
    label: 'Product class it covers',
    description: 'e.g. motherboard; empty covers every class',
    optional: true,
  },
  {
    name: 'matchPlatform',
    label: 'Platform it covers',
    description: 'e.g. Helix-1700; empty covers every platform',
    optional: true,
  },
];

/** The subjects readers choose from, with confirmed subscribers per subject; editors add, change and remove them. */
export function SubscriberCategories({ canEdit }: { canEdit: boolean }) {
  const { categories, subscribers } = useSubscriberCategories();
  const save = useSaveCategory();
  const remove = useDeleteCategory();
  const [draft, setDraft] = useState<Draft | null>(null);
  const fields = save.error && isApiError(save.error) ? save.error.fields : {};

  return (
    <Panel
      title="Subjects readers subscribe to"
      description={`${subscribers.confirmed} confirmed · ${subscribers.pending} waiting for confirmation · ${subscribers.unsubscribed} unsubscribed. Readers sign up at /subscribe.`}
      actions={
        canEdit && !draft ? (
          <Button size="sm" onClick={() => setDraft(emptyDraft)}>
            Add a subject
          </Button>
        ) : null
      }
    >
      <table className="w-full text-sm">
        <thead>
          <tr className="text-left text-muted">
            <th className="py-1 font-medium">Subject</th>
            <th className="py-1 font-medium">Roundups it covers</th>
            <th className="py-1 text-right font-medium">Confirmed</th>
            {canEdit && <th className="py-1" aria-label="Actions" />}
          </tr>
        </thead>
        <tbody>
          {categories.map((category) => (
            <tr key={category.id} className="border-t border-rule">
              <td className="py-1.5">{category.name}</td>
              <td className="py-1.5 text-muted">
                {[category.matchProductClass, category.matchPlatform].filter(Boolean).join(' · ') || 'Every roundup'}
              </td>
              <td className="py-1.5 text-right font-mono tabular-nums">{category.confirmedSubscribers}</td>
              {canEdit && (
                <td className="py-1.5 text-right whitespace-nowrap">
                  <Button
                    size="sm"
                    variant="quiet"
                    onClick={() =>
                      setDraft({
                        id: category.id,
                        name: category.name,
                        description: category.description ?? '',
                        matchProductClass: category.matchProductClass ?? '',
                        matchPlatform: category.matchPlatform ?? '',
                      })
                    }
                  >
                    Edit <span className="sr-only">{category.name}</span>
                  </Button>
                  <Button
                    size="sm"
                    variant="quiet"
                    pending={remove.isPending && remove.variables === category.id}
                    onClick={() => remove.mutate(category.id)}
                  >
                    Remove <span className="sr-only">{category.name}</span>
                  </Button>
                </td>
              )}
            </tr>
          ))}
        </tbody>
      </table>
      {remove.isError && (
        <Alert tone="danger" announce className="mt-3">
          {remove.error.message}
        </Alert>
      )}
      {draft && (
        <form
          className="mt-4 grid gap-3 sm:grid-cols-2"
          onSubmit={(event) => {
            event.preventDefault();
            save.mutate(
              {
                id: draft.id,
                input: {
                  name: draft.name,
                  description: draft.description || null,
                  matchProductClass: draft.matchProductClass || null,
                  matchPlatform: draft.matchPlatform || null,
                },
              },
              { onSuccess: () => setDraft(null) },
            );
          }}
        >
          {draftFields.map(({ name, ...field }) => (
            <TextField
              key={name}
              {...field}
              value={draft[name]}
              onChange={(e) => setDraft({ ...draft, [name]: e.target.value })}
              error={fields[name]}
            />
          ))}
          {save.isError && !Object.keys(fields).length && (
            <Alert tone="danger" announce className="sm:col-span-2">
              {save.error.message}
            </Alert>
          )}
          <div className="flex gap-2 sm:col-span-2">
            <Button type="submit" variant="primary" pending={save.isPending}>
              {draft.id === null ? 'Add subject' : 'Save subject'}
            </Button>
            <Button type="button" onClick={() => setDraft(null)}>
              Cancel
            </Button>
          </div>
        </form>
      )}
    </Panel>
  );
}
