/**
 * Lengths: kept in millimetres everywhere inside Reversa; entered and shown in mm or inches.
 * 1 in = 25.4 mm exactly (international yard and pound agreement, 1959; NIST Handbook 44, App. C).
 */
export const MM_PER_INCH = 25.4;
export const UNITS = ["mm", "in"] as const;
export type Unit = (typeof UNITS)[number];
export type Rounding = "nearest" | "down" | "up";
export type Denominator = 8 | 16 | 32 | 64;

export type ParseResult = { ok: true; mm: number } | { ok: false; message: string };

const FRACTION = /^(\d+)\s*\/\s*(\d+)$/;
const MIXED = /^(\d+(?:\.\d+)?)(?:\s+|\s*-\s*)(\d+)\s*\/\s*(\d+)$/;
const DECIMAL = /^\d*\.?\d+$/;

/**
 * Reads a length typed by a person: `210`, `210.5`, `7 5/8`, `7-5/8`, `7.625`, `5/8`,
 * optionally followed by its own unit (`mm`, `in`, `"`), which then wins over `unit`.
 */
export function parseLength(input: number | string, unit: Unit): ParseResult {
  if (typeof input === "number") {
    if (!Number.isFinite(input)) return { ok: false, message: "Enter a number." };
    return { ok: true, mm: unit === "in" ? input * MM_PER_INCH : input };
  }
  // A comma before exactly three digits groups thousands ("1,120" is 1120); any other comma is a decimal point ("12,5").
  let text = input
    .trim()
    .toLowerCase()
    .replace(/,(?=\d{3}(?:\D|$))/g, "")
    .replace(/,/g, ".");
  if (text === "") return { ok: false, message: "Enter a length." };
  let u: Unit = unit;
  const suffix = text.match(/\s*(mm|in|inch|inches|")$/);
  if (suffix) {
    u = suffix[1] === "mm" ? "mm" : "in";
    text = text.slice(0, text.length - suffix[0].length).trim();
  }
  // formatInches and formatMm write a true minus (U+2212); read it back as well as a hyphen.
  const negative = text.startsWith("-") || text.startsWith("\u2212");
  if (negative) text = text.slice(1).trim();
  let value: number | null = null;
  const mixed = DECIMAL.test(text) ? null : text.match(MIXED);
  const fraction = DECIMAL.test(text) || mixed ? null : text.match(FRACTION);
  if (DECIMAL.test(text)) value = Number(text);
  else if (mixed) {
    const m = mixed;
    const whole = Number(m[1]);
    const num = Number(m[2]);
    const den = Number(m[3]);
    if (den === 0) return { ok: false, message: "A fraction cannot have 0 below the line." };
    if (!Number.isInteger(whole)) return { ok: false, message: `Write "${input}" as a whole number and a fraction, e.g. 7 5/8.` };
    value = whole + num / den;
  } else if (fraction) {
    const m = fraction;
    const den = Number(m[2]);
    if (den === 0) return { ok: false, message: "A fraction cannot have 0 below the line." };
    value = Number(m[1]) / den;
  }
  if (value === null || !Number.isFinite(value)) {
    return { ok: false, message: u === "in" ? `"${input}" is not a length; write e.g. 7 5/8 or 7.625.` : `"${input}" is not a length in mm.` };
  }
  if (negative) value = -value;
  return { ok: true, mm: u === "in" ? value * MM_PER_INCH : value };
}

/** Rounds `value` to a multiple of `step` in the given direction, tolerant of float noise. */
export function roundTo(value: number, step: number, rounding: Rounding = "nearest"): number {
  const q = value / step;
  const eps = 1e-9;
  const n = rounding === "down" ? Math.floor(q + eps) : rounding === "up" ? Math.ceil(q - eps) : Math.round(q);
  return n * step;
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

/** Inches as a whole number and a reduced fraction: `7 5/8`, `5/8`, `8`. */
export function formatInches(mm: number, denominator: Denominator = 16, rounding: Rounding = "nearest"): string {
  const inches = mm / MM_PER_INCH;
  // Rounding "down" on a negative value means toward −∞ in length terms; apply it to the magnitude mirrored.
  const mag = Math.abs(inches);
  const dir: Rounding = inches < 0 ? (rounding === "down" ? "up" : rounding === "up" ? "down" : "nearest") : rounding;
  const ticks = Math.round(roundTo(mag, 1 / denominator, dir) * denominator);
  // A negative length that rounds to nothing is 0, not −0 (as formatMm does).
  const sign = inches < 0 && ticks > 0 ? "−" : "";
  const whole = Math.floor(ticks / denominator);
  const rest = ticks % denominator;
  if (rest === 0) return `${sign}${whole}`;
  const g = gcd(rest, denominator);
  const frac = `${rest / g}/${denominator / g}`;
  return whole === 0 ? `${sign}${frac}` : `${sign}${whole} ${frac}`;
}

/** Millimetres to one decimal at most, with a proper minus sign. */
export function formatMm(mm: number, rounding: Rounding = "nearest", step = 0.5): string {
  const v = roundTo(mm, step, rounding);
  const text = Number.isInteger(v) ? String(Math.abs(v)) : Math.abs(v).toFixed(1);
  return (v < 0 ? "−" : "") + text;
}

/** A length in the given unit, with its unit: `210 mm`, `7 5/8 in`. */
export function formatLength(mm: number, unit: Unit, opts: { rounding?: Rounding; denominator?: Denominator } = {}): string {
  return unit === "in" ? `${formatInches(mm, opts.denominator, opts.rounding)} in` : `${formatMm(mm, opts.rounding)} mm`;
}

/** Width × height as the trade writes it: `210 × 297 mm`, `8 × 10 in`. */
export function formatSize(widthMm: number, heightMm: number, unit: Unit, opts: { rounding?: Rounding; denominator?: Denominator } = {}): string {
  const f = (v: number) => (unit === "in" ? formatInches(v, opts.denominator, opts.rounding) : formatMm(v, opts.rounding));
  return `${f(widthMm)} × ${f(heightMm)} ${unit}`;
}

/** The value to put back in an input box for a stored length. */
export function lengthInputValue(mm: number | null | undefined, unit: Unit): string {
  if (mm === null || mm === undefined) return "";
  return unit === "in" ? formatInches(mm, 32) : formatMm(mm, "nearest", 0.1);
}
