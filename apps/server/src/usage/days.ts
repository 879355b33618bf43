/** Calendar days in UTC as `YYYY-MM-DD`, the unit of the rollups and of every date filter. */

const DAY_MS = 86_400_000;

export function addDays(day: string, n: number): string {
  return new Date(Date.parse(`${day}T00:00:00Z`) + n * DAY_MS).toISOString().slice(0, 10);
}

export const nextDay = (day: string): string => addDays(day, 1);

export const todayUtc = (now: Date = new Date()): string => now.toISOString().slice(0, 10);

/** Days from `from` to `to`, both included (1 when they are the same day). */
export function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / DAY_MS) + 1;
}

/** Every day from `from` to `to`, both included, oldest first. */
export function eachDay(from: string, to: string): string[] {
  const n = daysBetween(from, to);
  return Array.from({ length: Math.max(0, n) }, (_, i) => addDays(from, i));
}
