import { useEffect, useState } from 'react';

/**
 * The current time, refreshed every minute: access windows (a sitter's last day) are judged
 * against it, and shared/domain rules take `now` as an argument rather than reading a clock.
 */
export function useNow(intervalMs = 60_000): Date {
  const [now, setNow] = useState(() => new Date());
  useEffect(() => {
    const id = setInterval(() => setNow(new Date()), intervalMs);
    return () => clearInterval(id);
  }, [intervalMs]);
  return now;
}
