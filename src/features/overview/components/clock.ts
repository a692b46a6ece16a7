import { useEffect, useState } from 'react';
import { stationLocalLabel } from '../../../../shared/shift-time';

/** This device's clock, re-read every `periodMs`: ages and countdowns move on between fetches. */
export function useNow(periodMs = 15_000): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), periodMs);
    return () => clearInterval(timer);
  }, [periodMs]);
  return now;
}

/** "2026-03-29 06:00 (Europe/Berlin)": station time, with the zone named. */
export const stationTime = (iso: string, timeZone: string) => `${stationLocalLabel(new Date(iso), timeZone)} (${timeZone})`;

/** "12 min", "3 h 05 min", "2 d 4 h". */
export function formatAge(ms: number): string {
  const minutes = Math.max(0, Math.floor(ms / 60_000));
  if (minutes < 60) return `${minutes} min`;
  const hours = Math.floor(minutes / 60);
  if (hours < 24) return `${hours} h ${String(minutes % 60).padStart(2, '0')} min`;
  return `${Math.floor(hours / 24)} d ${hours % 24} h`;
}
