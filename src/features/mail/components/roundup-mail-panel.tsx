import { useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { TextArea } from '../../../components/ui/text-area';
import { isApiError } from '../../../lib/api-client';
import { useCreateMailing, useRoundupMailings, useSendTestMail } from '../api/subscribers';
import { MailingProgress } from './mailing-progress';
import type { RoundupSummary } from '../../../../shared/schemas/roundups';

/** For editors: a roundup's mailings with progress, a test to oneself, and mailing an update or correction. */
export function RoundupMailPanel({ roundup }: { roundup: RoundupSummary }) {
  const mailings = useRoundupMailings(roundup.id);
  const sendTest = useSendTestMail(roundup.id);
  const createMailing = useCreateMailing(roundup.id);
  const [kind, setKind] = useState<'update' | 'correction'>('update');
  const [note, setNote] = useState('');
  const live = roundup.state === 'live' || roundup.state === 'updated';
  const noteError =
    createMailing.error && isApiError(createMailing.error) ? createMailing.error.fields.note : undefined;

  return (
    <section aria-labelledby={`mail-${roundup.id}`} className="space-y-3 border-t border-rule py-4 first:border-t-0">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 id={`mail-${roundup.id}`} className="font-semibold text-ink">
          {roundup.title}
        </h3>
        <Button size="sm" pending={sendTest.isPending} onClick={() => sendTest.mutate()}>
          Send a test to me
        </Button>
      </div>
      {sendTest.isSuccess && (
        <Alert tone="success" announce>
          The go-live mail is on its way to {sendTest.data.sentTo}.
        </Alert>
      )}
      {sendTest.isError && (
        <Alert tone="danger" announce>
          {sendTest.error.message}
        </Alert>
      )}
      {mailings.data?.mailings.length ? (
        mailings.data.mailings.map((mailing) => <MailingProgress key={mailing.id} mailing={mailing} />)
      ) : (
        <p className="text-sm text-muted">
          {live ? 'No mailing yet.' : 'The go-live mail goes to its subscribers when the roundup is published.'}
        </p>
      )}
      {mailings.data && !mailings.data.sending && (
        <p className="text-sm text-muted">No mail relay is configured: mail waits in the outbox.</p>
      )}
      {live && (
        <form
          className="space-y-2"
          onSubmit={(event) => {
            event.preventDefault();
            createMailing.mutate({ kind, note }, { onSuccess: () => setNote('') });
          }}
        >
          <fieldset className="flex gap-4 text-sm">
            <legend className="sr-only">Kind of mailing</legend>
            {(['update', 'correction'] as const).map((value) => (
              <label key={value} className="flex items-center gap-1.5">
                <input
                  type="radio"
                  name={`kind-${roundup.id}`}
                  value={value}
                  checked={kind === value}
                  onChange={() => setKind(value)}
                  className="accent-copper"
                />
                {value === 'update' ? 'Update' : 'Correction'}
              </label>
            ))}
          </fieldset>
          <TextArea
            label="What changed (subscribers read this first)"
            value={note}
            onChange={(event) => setNote(event.target.value)}
            error={noteError}
            rows={2}
          />
          {createMailing.isError && !noteError && (
            <Alert tone="danger" announce>
              {createMailing.error.message}
            </Alert>
          )}
          <Button type="submit" pending={createMailing.isPending}>
            Mail this {kind} to subscribers
          </Button>
        </form>
      )}
    </section>
  );
}
