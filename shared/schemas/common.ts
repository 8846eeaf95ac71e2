import { z } from "zod";
import { isCalendarDate } from "../domain/dates.ts";

/**
 * A day as YYYY-MM-DD that is a real day of the calendar: every date written or filtered on goes
 * through this one schema (no 30 February, month 13 or year 0000).
 */
export const isoDate = (example = "2026-11-30") =>
  z.string({ message: `Use a real date such as ${example}.` }).refine(isCalendarDate, { message: `Use a real date such as ${example}.` });

/** A record's id as the API takes it (the ids it makes are UUIDs). */
const idText = () => z.string().min(1).max(64);
export const IdParamSchema = z.object({ id: idText() });
/** A reference that may be left out or null (a report's mounting, a user's client); either way it reads as null. */
export const optionalId = () =>
  idText()
    .nullable()
    .optional()
    .transform((v) => v ?? null);

/** Optional free text: trims, and turns an empty string into null. */
export const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, { message: `Keep this under ${max} characters.` })
    .transform((v) => (v === "" ? null : v))
    .nullable()
    .optional()
    .transform((v) => v ?? null);

export const requiredText = (max: number, message: string) =>
  z
    .string({ message })
    .trim()
    .min(1, { message })
    .max(max, { message: `Keep this under ${max} characters.` });

export const PageQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});

export type Page<T> = { items: T[]; total: number; page: number; pageSize: number };
