import { useEffect, useState } from 'react';

/** The current time, refreshed every `intervalMs`, so what depends on the clock (a valid period ending) updates on its own. */
export function useNow(intervalMs = 15_000): Date {
  const [now, setNow] = useState(() => new Date());
  useEffect(() => {
    const timer = window.setInterval(() => setNow(new Date()), intervalMs);
    return () => window.clearInterval(timer);
  }, [intervalMs]);
  return now;
}
