const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;

/** A real day of the calendar, not just the YYYY-MM-DD shape: 2026-02-30, month 13 and years before 1000 (0000 included) are refused. */
export function isCalendarDate(s: string): boolean {
  if (!ISO_DATE.test(s)) return false;
  const [y = NaN, m = NaN, d = NaN] = s.split("-").map(Number);
  if (y < 1000) return false;
  const t = new Date(Date.UTC(y, m - 1, d));
  return t.getUTCFullYear() === y && t.getUTCMonth() === m - 1 && t.getUTCDate() === d;
}
