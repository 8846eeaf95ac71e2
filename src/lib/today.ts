import { format } from "date-fns";

/**
 * Today as YYYY-MM-DD in the studio's time zone: the day forms default to and "due" filters send.
 * The studio's settings hold no time zone, so the studio's is the browser's own local date, never the
 * UTC date (which is already tomorrow, or still yesterday, for part of every day away from UTC).
 */
export const studioToday = (now: Date = new Date()): string => format(now, "yyyy-MM-dd");
