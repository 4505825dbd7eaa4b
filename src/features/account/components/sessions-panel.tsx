import { useMemo } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { DataTable, type DataTableColumn } from '../../../components/ui/data-table';
import { actionsColumn, dateColumn } from '../../../components/ui/data-table-columns';
import { DeviceTimeZoneNote } from '../../../components/ui/date-time';
import { Panel } from '../../../components/ui/panel';
import { formatInstant } from '../../../lib/format-time';
import type { SessionInfo } from '../../../../shared/schemas/auth';
import { useSessions } from '../api/get-sessions';
import { useRevokeSession } from '../api/revoke-session';

/** The platform part of a user-agent string, e.g. "X11; Linux x86_64", which says more than the rest. */
function platformOf(userAgent: string | null): string {
  if (!userAgent) return 'Unknown device';
  const platform = /\(([^)]+)\)/.exec(userAgent)?.[1];
  return platform ?? userAgent.slice(0, 60);
}

export function SessionsPanel({ className }: { className?: string }) {
  const sessions = useSessions();
  const revoke = useRevokeSession();

  const columns = useMemo<DataTableColumn<SessionInfo>[]>(
    () => [
      {
        id: 'device',
        header: 'Device',
        rowHeader: true,
        cell: (session) => (
          <span className="block max-w-[22rem] min-w-[11rem] font-normal">
            <span className="flex flex-wrap items-center gap-2">
              <span className="font-medium">{platformOf(session.userAgent)}</span>
              {session.current && <Badge tone="accent">This device</Badge>}
            </span>
            {session.userAgent && (
              <span className="mt-0.5 line-clamp-1 text-xs break-all text-muted" title={session.userAgent}>
                {session.userAgent}
              </span>
            )}
          </span>
        ),
      },
      {
        id: 'ip',
        header: 'Address',
        numeric: true,
        cell: (session) => session.ipAddress ?? <span className="text-muted">—</span>,
      },
      dateColumn('created', 'Signed in', (session) => session.createdAt, { instant: true }),
      dateColumn('expires', 'Expires', (session) => session.expiresAt, { instant: true }),
      actionsColumn((session) =>
        session.current ? (
          <span className="text-xs text-muted">Sign out ends it</span>
        ) : (
          <Button
            size="sm"
            variant="danger"
            pending={revoke.isPending && revoke.variables === session.id}
            onClick={() => revoke.mutate(session.id)}
            aria-label={`Revoke the session signed in ${formatInstant(session.createdAt)}`}
          >
            Revoke
          </Button>
        ),
      ),
    ],
    [revoke],
  );

  const others = sessions.filter((session) => !session.current).length;

  return (
    <Panel
      className={className}
      title="Where you are signed in"
      description={
        others === 0
          ? 'Only this device is signed in.'
          : `This device and ${others} other${others === 1 ? '' : 's'}. Revoke a session you do not recognise, then change your password.`
      }
    >
      {revoke.isError && (
        <Alert tone="danger" announce className="mb-3">
          The session was not revoked: {revoke.error.message}
        </Alert>
      )}
      <DataTable
        caption="Your sessions"
        rows={sessions}
        columns={columns}
        initialSort={{ columnId: 'created', direction: 'descending' }}
        noun={['session', 'sessions']}
        footnote={<DeviceTimeZoneNote />}
      />
    </Panel>
  );
}
