import { format, parseISO } from "date-fns";
import { formatLength, formatSize, type Unit } from "@shared/domain/units.ts";
import { formatMoney } from "@shared/domain/money.ts";

export { formatLength, formatSize, formatMoney };

export function formatDate(iso: string | null | undefined): string {
  if (!iso) return "—";
  const d = iso.length === 10 ? parseISO(iso) : new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : format(d, "d MMM yyyy");
}

export function formatDateTime(iso: string): string {
  return format(new Date(iso), "d MMM yyyy, HH:mm");
}

export function sheetSize(w: number, h: number, unit: Unit) {
  return formatSize(w, h, unit);
}
