import { startTransition, useEffect, useState } from 'react';

/**
 * The time now, refreshed every `everyMs` while a screen shows a countdown or an age. A tick is never urgent: it is
 * drawn in the background (a transition), so a board of a hundred countdowns does not hold a tap or a paint.
 */
export function useNow(everyMs = 1000): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = window.setInterval(() => startTransition(() => setNow(Date.now())), everyMs);
    return () => window.clearInterval(timer);
  }, [everyMs]);
  return now;
}
