import { isBefore, parseISO, startOfDay, subYears } from "date-fns";

/**
 * A valuation older than this is flagged on the schedule of values: insurers commonly ask for works to
 * be revalued every three to five years, and the schedule takes the shorter (common practice, no source;
 * trade reference §15).
 */
export const VALUATION_REVIEW_YEARS = 3;

/** True when the valuation dated `valuedOn` (YYYY-MM-DD) is more than VALUATION_REVIEW_YEARS before the day of `on`. */
export function valuationIsOld(valuedOn: string, on: Date): boolean {
  const d = parseISO(valuedOn);
  if (Number.isNaN(d.getTime())) return false;
  return isBefore(d, subYears(startOfDay(on), VALUATION_REVIEW_YEARS));
}
