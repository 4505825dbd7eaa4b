import { useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Panel } from '../../../components/ui/panel';
import { Select } from '../../../components/ui/select';
import { TextArea } from '../../../components/ui/text-area';
import { TextField } from '../../../components/ui/text-field';
import { ApiError } from '../../../lib/api-client';
import { roundupStateLabels } from '../../../../shared/domain/planning/roundup-states';
import {
  formatUtcOffset,
  instantToZonedTime,
  zonedTimeToInstant,
} from '../../../../shared/domain/publishing/zoned-time';
import type { RoundupPublishing } from '../../../../shared/schemas/publishing';
import {
  useCreatePreviewLink,
  usePublishing,
  usePublishUpdate,
  useScheduleRoundup,
  useUnscheduleRoundup,
} from '../api/publishing';
import { useSubmitProblems } from './use-submit-problems';

export interface PublishingPanelProps {
  roundupId: number;
  /** The roundup's own zone: the schedule form starts in it. */
  defaultTimeZone: string;
  canEdit: boolean;
}

const browserZone = Intl.DateTimeFormat().resolvedOptions().timeZone;

type Problem = RoundupPublishing['readiness']['problems'][number];

/** The blockers a refusal names (422 `not_ready` carries them in its details), or none. */
function refusedProblems(error: unknown): Problem[] {
  if (!(error instanceof ApiError) || error.code !== 'not_ready') return [];
  const details = error.details as { problems?: Problem[] } | null;
  return Array.isArray(details?.problems) ? details.problems : [];
}

/** Each blocker in words, linked to the screen where it is fixed. */
function ProblemList({ problems, label }: { problems: Problem[]; label: string }) {
  return (
    <ul className="mb-3 list-disc space-y-1 pl-5 text-sm" aria-label={label}>
      {problems.map((problem, index) => (
        <li key={`${index}-${problem.message}`}>
          {problem.link ? (
            <Link className="underline" to={problem.link}>
              {problem.message}
            </Link>
          ) : (
            problem.message
          )}
        </li>
      ))}
    </ul>
  );
}

type ScheduleValues = { date: string; time: string; timeZone: string };

/** The embargo as the editor types it: a wall-clock date and time in a named zone. */
const scheduleFields: {
  name: keyof ScheduleValues;
  label: string;
  type?: string;
  step?: number;
  description?: string;
}[] = [
  { name: 'date', label: 'Date', type: 'date' },
  { name: 'time', label: 'Time', type: 'time', step: 1 },
  { name: 'timeZone', label: 'Time zone', description: 'An IANA name, e.g. Europe/Berlin' },
];

function inZone(instant: string, timeZone: string) {
  const local = instantToZonedTime(new Date(instant), timeZone);
  return `${local.date} ${local.time} ${timeZone}`;
}

/** Schedule, reschedule or unschedule the embargo; publish updates; share a preview link. */
export function PublishingPanel({ roundupId, defaultTimeZone, canEdit }: PublishingPanelProps) {
  const publishing = usePublishing(roundupId);
  const schedule = useScheduleRoundup();
  const unschedule = useUnscheduleRoundup();
  const publishUpdate = usePublishUpdate();
  const previewLink = useCreatePreviewLink();
  const [when, setWhen] = useState<ScheduleValues>(() => {
    const { date, time, timeZone } = publishing.schedule ?? { date: '', time: '09:00', timeZone: defaultTimeZone };
    return { date, time, timeZone };
  });
  const problems = useSubmitProblems();
  const { fields, message } = problems;
  const [refused, setRefused] = useState<Problem[]>([]);
  const [notice, setNotice] = useState<string | null>(null);
  const [kind, setKind] = useState<'update' | 'correction'>('update');
  const [note, setNote] = useState('');
  const [link, setLink] = useState<{ url: string; expiresAt: string } | null>(null);

  const zoned = when.date && when.time ? zonedTimeToInstant(when) : null;
  const live = publishing.state === 'live' || publishing.state === 'updated';
  const fail = (error: unknown) => {
    problems.fail(error);
    setRefused(refusedProblems(error));
  };

  const submitSchedule = (event: FormEvent) => {
    event.preventDefault();
    problems.clear();
    setRefused([]);
    schedule.mutate(
      { id: roundupId, schedule: when },
      { onSuccess: () => setNotice('Scheduled. It goes live by itself at that time.'), onError: fail },
    );
  };

  const submitUpdate = (event: FormEvent) => {
    event.preventDefault();
    problems.clear();
    publishUpdate.mutate(
      { id: roundupId, kind, note },
      {
        onSuccess: () => {
          setNote('');
          setNotice(`The ${kind} is published and logged on the page.`);
        },
        onError: fail,
      },
    );
  };

  return (
    <div className="space-y-5">
      {notice && (
        <Alert tone="success" title={notice} announce>
          {publishing.publicPath && live && (
            <a href={publishing.publicPath} className="underline">
              Open the public page
            </a>
          )}
        </Alert>
      )}
      {message && (
        <Alert tone="danger" title="That did not work" announce>
          {refused.length > 0 ? <ProblemList problems={refused} label="What blocks scheduling" /> : message}
        </Alert>
      )}

      <Panel
        title="Embargo"
        description={`State: ${roundupStateLabels[publishing.state]}. Before this time the roundup is on no public page, feed or file.`}
      >
        {publishing.schedule && (
          <p className="mb-3" data-testid="schedule-summary">
            Goes live <strong>{inZone(publishing.schedule.publishAt, publishing.schedule.timeZone)}</strong> (
            {publishing.schedule.utcOffset}) = <span className="numeric">{publishing.schedule.publishAt}</span> UTC
            {browserZone !== publishing.schedule.timeZone && (
              <> · your time {inZone(publishing.schedule.publishAt, browserZone)}</>
            )}
          </p>
        )}
        {live && (
          <p className="mb-3">
            The roundup is live
            {publishing.publicPath && (
              <>
                {' '}
                at{' '}
                <a className="underline" href={publishing.publicPath}>
                  {publishing.publicPath}
                </a>
              </>
            )}
            .
          </p>
        )}
        {!publishing.readiness.ready && !live && (
          <>
            <p className="mb-2 text-sm font-medium">Not ready to schedule. Each of these must be settled first:</p>
            <ProblemList problems={publishing.readiness.problems} label="What blocks scheduling" />
          </>
        )}
        {canEdit && !live && (publishing.readiness.ready || publishing.schedule) && (
          <form onSubmit={submitSchedule} noValidate className="grid gap-3 sm:grid-cols-3">
            {scheduleFields.map(({ name, ...field }) => (
              <TextField
                key={name}
                {...field}
                required
                value={when[name]}
                onChange={(e) => setWhen((current) => ({ ...current, [name]: e.target.value }))}
                error={fields[name]}
              />
            ))}
            <p className="text-sm sm:col-span-3" aria-live="polite">
              {zoned?.ok
                ? `= ${zoned.instant.toISOString()} UTC (${formatUtcOffset(zoned.offsetMinutes)})${zoned.ambiguous ? ' — this time happens twice that night; the first is used' : ''}`
                : zoned
                  ? zoned.message
                  : 'Choose the date and time.'}
            </p>
            <div className="flex gap-2 sm:col-span-3">
              <Button type="submit" variant="primary" pending={schedule.isPending}>
                {publishing.schedule ? 'Reschedule' : 'Schedule'}
              </Button>
              {publishing.schedule && (
                <Button
                  type="button"
                  variant="danger"
                  pending={unschedule.isPending}
                  onClick={() =>
                    unschedule.mutate(roundupId, {
                      onSuccess: () => setNotice('Unscheduled: back In review.'),
                      onError: fail,
                    })
                  }
                >
                  Unschedule
                </Button>
              )}
            </div>
          </form>
        )}
      </Panel>

      {canEdit && live && (
        <Panel
          title="Publish an update"
          description="Edits reach readers only when you publish them, with a dated note on the page."
        >
          <form onSubmit={submitUpdate} noValidate className="space-y-3">
            <Select
              label="Kind"
              value={kind}
              onChange={(e) => setKind(e.target.value as 'update' | 'correction')}
              options={[
                { value: 'update', label: 'Update' },
                { value: 'correction', label: 'Correction' },
              ]}
            />
            <TextArea
              label="Note for readers"
              required
              value={note}
              onChange={(e) => setNote(e.target.value)}
              error={fields.note}
            />
            <Button type="submit" variant="primary" pending={publishUpdate.isPending}>
              Publish the {kind}
            </Button>
          </form>
        </Panel>
      )}

      {publishing.publications.length > 0 && (
        <Panel title="Publications">
          <ol className="space-y-1 text-sm">
            {publishing.publications.map((p) => (
              <li key={p.version}>
                <span className="numeric">{p.publishedAt}</span> · {p.kind}
                {p.note && <> — {p.note}</>}
              </li>
            ))}
          </ol>
        </Panel>
      )}

      {canEdit && !live && (
        <Panel
          title="Preview link"
          description="Anyone with the link can read the page as it stands now, without an account, for 48 hours."
        >
          <Button
            type="button"
            pending={previewLink.isPending}
            onClick={() => previewLink.mutate({ id: roundupId, hours: 48 }, { onSuccess: setLink, onError: fail })}
          >
            Make a preview link
          </Button>
          {link && (
            <p className="mt-3 break-all text-sm">
              <a className="underline" href={link.url}>
                {link.url}
              </a>{' '}
              (until {link.expiresAt})
            </p>
          )}
        </Panel>
      )}
    </div>
  );
}
