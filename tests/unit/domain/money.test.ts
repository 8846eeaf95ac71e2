import { describe, expect, it } from "vitest";
import { formatMoney, isCurrencyCode, minorDigits, parseMoney } from "../../../shared/domain/money.ts";

describe("minorDigits", () => {
  it("when a currency has a minor unit, then its digits follow ISO 4217", () => {
    // ISO 4217 minor units: GBP 2, EUR 2, USD 2, JPY 0, BHD 3, KWD 3.
    expect(minorDigits("GBP")).toBe(2);
    expect(minorDigits("EUR")).toBe(2);
    expect(minorDigits("USD")).toBe(2);
    expect(minorDigits("JPY")).toBe(0);
    expect(minorDigits("BHD")).toBe(3);
    expect(minorDigits("KWD")).toBe(3);
  });

  it("when the code is not a currency, then it falls back to 2 digits", () => {
    expect(minorDigits("not a code")).toBe(2);
  });
});

describe("isCurrencyCode", () => {
  it("when the code is a current ISO 4217 code, then it is accepted", () => {
    for (const c of ["GBP", "EUR", "USD", "JPY", "CHF"]) expect(isCurrencyCode(c)).toBe(true);
  });

  it("when the code is well formed but not a currency, then it is refused", () => {
    expect(isCurrencyCode("ABC")).toBe(false);
    expect(isCurrencyCode("QQQ")).toBe(false);
  });

  it("when the code is lower case or the wrong length, then it is refused", () => {
    expect(isCurrencyCode("gbp")).toBe(false);
    expect(isCurrencyCode("GB")).toBe(false);
    expect(isCurrencyCode("GBPX")).toBe(false);
    expect(isCurrencyCode("")).toBe(false);
  });
});

describe("formatMoney", () => {
  it("when pence are formatted, then they show as pounds with two decimals", () => {
    expect(formatMoney(420000, "GBP")).toBe("£4,200.00");
    expect(formatMoney(5, "GBP")).toBe("£0.05");
  });

  it("when a currency has no minor unit, then the integer is the whole amount", () => {
    expect(formatMoney(123456, "JPY")).toMatch(/¥123,456$/);
  });

  it("when a currency has three decimals, then three are shown", () => {
    expect(formatMoney(1234567, "BHD")).toContain("1,234.567");
  });

  it("when a locale is given, then its separators are used", () => {
    expect(formatMoney(150000, "USD", "en-US")).toBe("$1,500.00");
    // Non-breaking space between amount and sign in de-DE.
    expect(formatMoney(150000, "EUR", "de-DE").replace(/\s/g, " ")).toBe("1.500,00 €");
  });
});

describe("parseMoney", () => {
  it.each([
    ["thousands separators are ignored", "12,500.00", "GBP", 1250000],
    ["thousands separators are ignored", "12 500", "GBP", 1250000],
    ["thousands separators are ignored", "12500", "GBP", 1250000],
    ["fewer decimals than the currency's are padded", "0.1", "GBP", 10],
    ["fewer decimals than the currency's are padded", "12500.5", "GBP", 1250050],
    ["more decimals than the currency has is not an amount", "1.005", "GBP", null],
    ["more decimals than the currency has is not an amount", "1.5", "JPY", null],
    ["with no or three minor digits the integer follows the currency", "1500", "JPY", 1500],
    ["with no or three minor digits the integer follows the currency", "1.234", "BHD", 1234],
    ["empty text is not an amount", "", "GBP", null],
    ["a negative is not an amount", "-5", "GBP", null],
    ["text that is not a number is not an amount", "£5", "GBP", null],
    ["text that is not a number is not an amount", "five", "GBP", null],
  ] as const)("when %s (%j in %s), then it reads as %s", (_case, text, currency, minor) => {
    expect(parseMoney(text, currency)).toBe(minor);
  });

  it("when an amount is parsed and formatted, then it comes back the same", () => {
    const minor = parseMoney("4,200.00", "GBP");
    expect(minor).toBe(420000);
    expect(formatMoney(minor!, "GBP")).toBe("£4,200.00");
  });
});
