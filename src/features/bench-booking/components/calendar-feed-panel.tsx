import { useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { Panel } from '../../../components/ui/panel';
import { TextField } from '../../../components/ui/text-field';
import { describeSubmitError } from '../../../lib/form-errors';
import { formatInstant } from '../../../lib/format-time';
import { useCalendarFeed, useDisableCalendarFeed, useResetCalendarFeed } from '../api/calendar-feed';

/**
 * The tester's private calendar address: their bookings and due dates in whatever calendar they already use. The
 * secret in the address is not kept by the server, so it is shown once, when it is made; a lost or leaked address is
 * replaced with Reset, which stops the old one at once.
 */
export function CalendarFeedPanel({ className }: { className?: string }) {
  const feed = useCalendarFeed();
  const reset = useResetCalendarFeed();
  const disable = useDisableCalendarFeed();
  const [address, setAddress] = useState<string | null>(null);
  const [copied, setCopied] = useState(false);
  const [confirming, setConfirming] = useState<'reset' | 'disable' | null>(null);
  const [error, setError] = useState<string | undefined>();

  const make = () => {
    setError(undefined);
    reset.mutate(undefined, {
      onSuccess: (created) => {
        setAddress(new URL(created.path, window.location.origin).toString());
        setCopied(false);
        setConfirming(null);
      },
      onError: (failure) => setError(describeSubmitError(failure).message),
    });
  };

  const turnOff = () => {
    setError(undefined);
    disable.mutate(undefined, {
      onSuccess: () => {
        setAddress(null);
        setConfirming(null);
      },
      onError: (failure) => setError(describeSubmitError(failure).message),
    });
  };

  const copy = async () => {
    if (!address) return;
    try {
      await navigator.clipboard.writeText(address);
      setCopied(true);
    } catch {
      setError('The address could not be copied here; select it and copy it by hand.');
    }
  };

  return (
    <Panel
      title="Bench calendar"
      description="Your bookings and due dates in your own calendar app, by a private address it subscribes to."
      className={className}
    >
      <div className="space-y-3">
        {error && !confirming && <Alert tone="danger">{error}</Alert>}
        {address ? (
          <>
            <TextField
              label="Your calendar address"
              readOnly
              value={address}
              onFocus={(event) => event.target.select()}
              description="Shown only now. Anyone with it can see your bookings: keep it to yourself."
              addon={
                <Button onClick={() => void copy()} aria-describedby={copied ? 'calendar-copied' : undefined}>
                  Copy
                </Button>
              }
            />
            {copied && (
              <Alert tone="success" announce>
                <span id="calendar-copied">Copied. Add it in your calendar app as a subscription by address.</span>
              </Alert>
            )}
          </>
        ) : feed.enabled ? (
          <p className="text-sm">
            Your address was made {feed.createdAt ? formatInstant(feed.createdAt) : 'earlier'}. It is shown only once;
            if you no longer have it, or someone else might, make a new one: the old one stops working.
          </p>
        ) : (
          <p className="text-sm">No calendar address yet. Make one, then add it to your calendar app.</p>
        )}
        <div className="flex flex-wrap gap-2">
          {feed.enabled ? (
            <>
              <Button onClick={() => setConfirming('reset')}>Reset address</Button>
              <Button variant="quiet" onClick={() => setConfirming('disable')}>
                Turn off
              </Button>
            </>
          ) : (
            <Button variant="primary" pending={reset.isPending} onClick={make}>
              Make my calendar address
            </Button>
          )}
        </div>
      </div>
      <ConfirmDialog
        open={confirming !== null}
        title={confirming === 'reset' ? 'Make a new calendar address?' : 'Turn the calendar off?'}
        confirmLabel={confirming === 'reset' ? 'Make a new address' : 'Turn off'}
        cancelLabel="Keep the current one"
        pending={reset.isPending || disable.isPending}
        error={confirming ? error : undefined}
        onConfirm={confirming === 'reset' ? make : turnOff}
        onCancel={() => setConfirming(null)}
      >
        <p>
          The current address stops working at once; calendar apps that use it show no more updates
          {confirming === 'reset' ? ' until you give them the new one' : ''}.
        </p>
      </ConfirmDialog>
    </Panel>
  );
}
