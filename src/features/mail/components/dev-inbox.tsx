import { useState } from 'react';
import { useSearchParams } from 'react-router';
import { Alert } from '../../../components/ui/alert';
import { DateTime } from '../../../components/ui/date-time';
import { EmptyState } from '../../../components/ui/empty-state';
import { LoadingState } from '../../../components/ui/loading-state';
import { Panel } from '../../../components/ui/panel';
import { cx } from '../../../lib/class-names';
import { useDevInbox, useDevInboxMessage } from '../api/get-dev-inbox';
import type { DevInboxMessage } from '../../../../shared/schemas/dev-inbox';

type View = 'html' | 'text' | 'headers';

/** The local relay's messages, newest first, and the chosen one as HTML (sandboxed), plain text or headers. */
export function DevInbox() {
  const inbox = useDevInbox();
  const [search, setSearch] = useSearchParams();
  const chosen = Number(search.get('message')) || null;

  if (!inbox.enabled) {
    return (
      <EmptyState title="No dev inbox">
        Mail goes through the relay SMTP_URL names, so nothing is kept here. The dev inbox exists only with the local
        relay that <code>npm start</code> and <code>npm test</code> start.
      </EmptyState>
    );
  }
  if (inbox.messages.length === 0) {
    return (
      <EmptyState title="Nothing received yet">
        Messages the app sends appear here within a few seconds. Nothing is forwarded to real mailboxes.
      </EmptyState>
    );
  }
  return (
    <div className="grid gap-4 lg:grid-cols-[minmax(16rem,22rem)_1fr]">
      <nav aria-label="Messages">
        <p className="mb-2 text-sm text-muted">
          {inbox.total === 1 ? '1 message' : `${inbox.total} messages`}
          {inbox.total > inbox.messages.length ? `, the newest ${inbox.messages.length} shown` : ''}
        </p>
        <ul className="divide-y divide-rule rounded-[3px] border border-rule bg-surface">
          {inbox.messages.map((message) => (
            <li key={message.id}>
              <button
                type="button"
                aria-current={message.id === chosen ? 'true' : undefined}
                onClick={() => setSearch({ message: String(message.id) })}
                className={cx(
                  'block w-full px-3 py-2 text-left hover:bg-wash focus-visible:outline-2',
                  message.id === chosen && 'bg-wash',
                )}
              >
                <span className="block truncate font-medium text-ink">{message.subject || '(no subject)'}</span>
                <span className="block truncate text-sm text-muted">To {message.to}</span>
                <span className="block text-xs text-muted">
                  <DateTime value={message.receivedAt} />
                </span>
              </button>
            </li>
          ))}
        </ul>
      </nav>
      {chosen ? <MessageView id={chosen} /> : <p className="text-sm text-muted">Choose a message to read it.</p>}
    </div>
  );
}

function MessageView({ id }: { id: number }) {
  const message = useDevInboxMessage(id);
  if (message.isPending) return <LoadingState label="Opening the message…" />;
  if (message.isError)
    return (
      <Alert tone="danger" announce>
        {message.error.message}
      </Alert>
    );
  return <MessageBody message={message.data} />;
}

function MessageBody({ message }: { message: DevInboxMessage }) {
  const [view, setView] = useState<View>(message.html ? 'html' : 'text');
  const views: { id: View; label: string; available: boolean }[] = [
    { id: 'html', label: 'HTML', available: message.html !== null },
    { id: 'text', label: 'Plain text', available: message.text !== null },
    { id: 'headers', label: 'Headers', available: true },
  ];
  return (
    <Panel
      title={message.subject || '(no subject)'}
      description={
        <>
          From {message.from} to {message.to} · <DateTime value={message.receivedAt} />
        </>
      }
    >
      <div role="group" aria-label="Show the message as" className="mb-3 flex gap-2">
        {views
          .filter((v) => v.available)
          .map((v) => (
            <button
              key={v.id}
              type="button"
              aria-pressed={view === v.id}
              onClick={() => setView(v.id)}
              className={cx(
                'rounded-[3px] border px-2.5 py-1 text-sm',
                view === v.id ? 'border-copper bg-copper text-on-accent' : 'border-edge bg-surface text-ink',
              )}
            >
              {v.label}
            </button>
          ))}
      </div>
      {view === 'html' && message.html !== null && (
        // The message's HTML comes as a page of its own with its own Content-Security-Policy (its inline styles
        // apply, nothing runs); the sandbox keeps it from the app. Links open in a new tab.
        <iframe
          title={`HTML of “${message.subject}”`}
          sandbox="allow-popups allow-popups-to-escape-sandbox"
          src={`/api/dev-inbox/${message.id}/html`}
          className="h-[36rem] w-full rounded-[3px] border border-rule bg-white"
        />
      )}
      {view === 'text' && (
        <pre className="max-h-[36rem] overflow-auto font-mono text-sm break-words whitespace-pre-wrap text-ink">
          {message.text}
        </pre>
      )}
      {view === 'headers' && (
        <dl className="grid grid-cols-[max-content_1fr] gap-x-3 gap-y-1 font-mono text-xs">
          {message.headers.map((header, index) => (
            <div key={index} className="contents">
              <dt className="font-semibold text-ink">{header.name}</dt>
              <dd className="break-all text-muted">{header.value}</dd>
            </div>
          ))}
        </dl>
      )}
      {message.attachments.length > 0 && (
        <p className="mt-3 text-sm text-muted">
          Parts:{' '}
          {message.attachments
            .map((a) => `${a.filename ?? a.contentId ?? 'unnamed'} (${a.contentType}${a.inline ? ', inline' : ''})`)
            .join('; ')}
        </p>
      )}
    </Panel>
  );
}
