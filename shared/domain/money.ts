/** Money is kept as integer minor units with an ISO 4217 currency code. */
export function minorDigits(currency: string): number {
  try {
    return new Intl.NumberFormat("en", { style: "currency", currency }).resolvedOptions().maximumFractionDigits ?? 2;
  } catch {
    return 2;
  }
}

export function formatMoney(minor: number, currency: string, locale = "en-GB"): string {
  const digits = minorDigits(currency);
  return new Intl.NumberFormat(locale, { style: "currency", currency, minimumFractionDigits: digits, maximumFractionDigits: digits }).format(minor / 10 ** digits);
}

/** Reads "12,500.00" or "12500" into minor units; null when it is not an amount. */
export function parseMoney(text: string, currency: string): number | null {
  const clean = text.replace(/[\s,_]/g, "");
  if (!/^\d+(\.\d+)?$/.test(clean)) return null;
  const digits = minorDigits(currency);
  const [whole, frac = ""] = clean.split(".");
  if (frac.length > digits) return null;
  return Number(whole) * 10 ** digits + Number((frac + "0".repeat(digits)).slice(0, digits) || "0");
}

export function isCurrencyCode(code: string): boolean {
  if (!/^[A-Z]{3}$/.test(code)) return false;
  try {
    new Intl.NumberFormat("en", { style: "currency", currency: code });
    return (Intl as unknown as { supportedValuesOf?: (k: string) => string[] }).supportedValuesOf?.("currency").includes(code) ?? true;
  } catch {
    return false;
  }
}
