import { useEffect, useState } from 'react';
import { Notice } from './ui';

/** "8 seconds", "2 min 30 s": how long is left, in words a person reads at a glance. */
export function waitText(seconds: number): string {
  const s = Math.max(0, Math.ceil(seconds));
  if (s < 60) return `${s} second${s === 1 ? '' : 's'}`;
  const m = Math.floor(s / 60);
  const rest = s % 60;
  return rest ? `${m} min ${rest} s` : `${m} min`;
}

/** Seconds left until `until` (epoch ms), ticking once a second; 0 once it has passed. */
export function useSecondsLeft(until: number | null): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (until === null) return;
    // The first tick right away (not during the effect itself), then once a second.
    const first = setTimeout(() => setNow(Date.now()), 0);
    const timer = setInterval(() => setNow(Date.now()), 1000);
    return () => {
      clearTimeout(first);
      clearInterval(timer);
    };
  }, [until]);
  return until === null ? 0 : Math.max(0, Math.ceil((until - now) / 1000));
}

/**
 * Sign-in was slowed after failed attempts: say so, why, and for how long, counting down. The
 * server never locks the account; a browser that signed in to it before is not slowed.
 */
export function SlowedNotice({ secondsLeft, byClient }: { secondsLeft: number; byClient: boolean }) {
  return (
    <Notice tone="warn" role="status">
      <p className="font-semibold">
        {secondsLeft > 0
          ? `Sign-in is slowed: try again in ${waitText(secondsLeft)}.`
          : 'You can try again now.'}
      </p>
      <p className="mt-1">
        {byClient
          ? 'There have been many failed sign-ins from your network, so attempts from it are spaced out for a while.'
          : 'There have been several failed sign-ins for this address, so attempts from here are spaced out a little longer each time.'}{' '}
        Your account is not locked.
      </p>
    </Notice>
  );
}
