import { useEffect, useState } from 'react';
import { formatClockTime } from '../../../lib/format-time';
import { countOf } from '../../../lib/plural';

function inWords(seconds: number): string {
  if (seconds < 60) return countOf(seconds, 'second', 'seconds');
  return countOf(Math.ceil(seconds / 60), 'minute', 'minutes');
}

/**
 * "You can try again in 25 seconds (at 10:42:15)." counting down once a second, then "You can try again now."
 * The lock after wrong passwords is short and lifts by itself, so the page says when it has passed. Give it a
 * `key` of `until` so a new answer starts a fresh count.
 */
export function RetryCountdown({ until }: { until: number }) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = window.setInterval(() => {
      const current = Date.now();
      setNow(current);
      if (current >= until) window.clearInterval(timer);
    }, 1000);
    return () => window.clearInterval(timer);
  }, [until]);

  const left = Math.ceil((until - now) / 1000);
  if (left <= 0) return <p className="mt-1">You can try again now.</p>;
  const at = formatClockTime(new Date(until), { seconds: left < 120 });
  return (
    <p className="mt-1">
      You can try again in {inWords(left)} (at {at}).
    </p>
  );
}
