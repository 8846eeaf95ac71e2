import { describe, expect, it } from "vitest";
import { MM_PER_INCH, formatInches, formatLength, formatMm, formatSize, lengthInputValue, parseLength, roundTo } from "../../../shared/domain/units.ts";

/** The millimetres of a parse that must succeed. */
function mmOf(input: string | number, unit: "mm" | "in"): number {
  const r = parseLength(input, unit);
  if (!r.ok) throw new Error(`expected "${input}" to parse, got: ${r.message}`);
  return r.mm;
}

/** The message of a parse that must fail. */
function messageOf(input: string | number, unit: "mm" | "in"): string {
  const r = parseLength(input, unit);
  if (r.ok) throw new Error(`expected "${input}" to be refused, got ${r.mm} mm`);
  return r.message;
}

describe("the inch", () => {
  it("when converting, then 1 in is 25.4 mm exactly", () => {
    // 1959 international yard and pound agreement; NIST Handbook 44, Appendix C.
    expect(MM_PER_INCH).toBe(25.4);
    expect(mmOf("1", "in")).toBe(25.4);
    expect(mmOf(1, "in")).toBe(25.4);
    expect(formatInches(25.4)).toBe("1");
    // 12 in = 304.8 mm exactly (same source).
    expect(formatInches(304.8)).toBe("12");
  });
});

describe("parseLength", () => {
  // 7 5/8 in = 7.625 × 25.4 = 193.675 mm (arithmetic on the exact inch above).
  const SEVEN_FIVE_EIGHTHS_MM = 193.675;

  it("when a mixed fraction is written with a space, then it reads as inches", () => {
    expect(mmOf("7 5/8", "in")).toBeCloseTo(SEVEN_FIVE_EIGHTHS_MM, 9);
  });

  it("when a mixed fraction is written with a hyphen, then it reads the same", () => {
    expect(mmOf("7-5/8", "in")).toBeCloseTo(SEVEN_FIVE_EIGHTHS_MM, 9);
    expect(mmOf("7 - 5/8", "in")).toBeCloseTo(SEVEN_FIVE_EIGHTHS_MM, 9);
  });

  it("when the same length is written as a decimal, then it reads the same", () => {
    expect(mmOf("7.625", "in")).toBeCloseTo(SEVEN_FIVE_EIGHTHS_MM, 9);
  });

  it("when a comma stands before three digits, then it groups thousands; otherwise it is a decimal point", () => {
    // 1120 × 815 mm is a standard full board sheet: common practice (no source). "1,120" must never read as 1.12 mm.
    expect(mmOf("1,120", "mm")).toBe(1120);
    expect(mmOf("1,120.5", "mm")).toBe(1120.5);
    expect(mmOf("12,5", "mm")).toBe(12.5);
  });

  it("when a bare fraction is written, then it reads as that part of an inch", () => {
    // 5/8 in = 15.875 mm.
    expect(mmOf("5/8", "in")).toBeCloseTo(15.875, 9);
  });

  it("when a whole number is written in a mm studio, then it is that many mm", () => {
    expect(mmOf("210", "mm")).toBe(210);
    expect(mmOf(" 210.5 ", "mm")).toBe(210.5);
  });

  it("when a decimal comma is written, then it reads as a decimal point", () => {
    expect(mmOf("210,5", "mm")).toBe(210.5);
  });

  it("when the text carries mm, then mm wins over an inch studio", () => {
    expect(mmOf("12mm", "in")).toBe(12);
    expect(mmOf("12 mm", "in")).toBe(12);
  });

  it("when the text carries an inch mark, then inches win over a mm studio", () => {
    // 8 in = 203.2 mm; 8 × 10 in is a standard frame size (CCI Notes 11/5).
    expect(mmOf('8"', "mm")).toBeCloseTo(203.2, 9);
    expect(mmOf("10 in", "mm")).toBeCloseTo(254, 9);
    expect(mmOf("7 5/8 inches", "mm")).toBeCloseTo(SEVEN_FIVE_EIGHTHS_MM, 9);
  });

  it("when a number rather than text is given, then the unit applies to it", () => {
    expect(mmOf(10, "in")).toBeCloseTo(254, 9);
    expect(mmOf(10, "mm")).toBe(10);
  });

  it("when a minus sign leads, then the length is negative (a float reveal is a negative overlap)", () => {
    expect(mmOf("-3", "mm")).toBe(-3);
    expect(mmOf("-1/8", "in")).toBeCloseTo(-3.175, 9);
  });

  it.each([
    ["the box is empty, it asks for a length", "", "mm", "Enter a length."],
    ["the box is empty, it asks for a length", "   ", "in", "Enter a length."],
    ["the text is not a length in an inch studio, the message shows how to write one", "seven", "in", '"seven" is not a length; write e.g. 7 5/8 or 7.625.'],
    ["the text is not a length in a mm studio, the message says mm", "abc", "mm", '"abc" is not a length in mm.'],
    ["the text is not a length in a mm studio, the message says mm", "12 cm", "mm", '"12 cm" is not a length in mm.'],
    ["the text is not a length in a mm studio, the message says mm", "1.2.3", "mm", '"1.2.3" is not a length in mm.'],
    ["a fraction has 0 below the line, it is refused with that reason", "5/0", "in", "A fraction cannot have 0 below the line."],
    ["a fraction has 0 below the line, it is refused with that reason", "7 5/0", "in", "A fraction cannot have 0 below the line."],
    ["a decimal is mixed with a fraction, it asks for a whole number and a fraction", "7.5 1/2", "in", 'Write "7.5 1/2" as a whole number and a fraction, e.g. 7 5/8.'],
    ["a number is not finite, it asks for a number", Number.NaN, "mm", "Enter a number."],
    ["a number is not finite, it asks for a number", Number.POSITIVE_INFINITY, "in", "Enter a number."],
  ] as const)("when %s (%j in %s)", (_case, text, unit, message) => {
    expect(messageOf(text, unit)).toBe(message);
  });
});

describe("roundTo", () => {
  it("when rounding down, then float noise just under a step does not drop a whole step", () => {
    // 0.3 / 0.1 is 2.9999999999999996 in binary floating point.
    expect(roundTo(0.3, 0.1, "down")).toBeCloseTo(0.3, 12);
    expect(roundTo(0.3, 0.1, "up")).toBeCloseTo(0.3, 12);
  });

  it("when rounding each way, then down never exceeds and up never falls short of the value", () => {
    expect(roundTo(10.26, 0.5, "down")).toBe(10);
    expect(roundTo(10.26, 0.5, "up")).toBe(10.5);
    expect(roundTo(10.26, 0.5, "nearest")).toBe(10.5);
    expect(roundTo(10.24, 0.5, "nearest")).toBe(10);
  });
});

describe("formatInches", () => {
  it("when the length is a whole number of inches, then no fraction is shown", () => {
    expect(formatInches(203.2)).toBe("8");
  });

  it("when the length has a fraction, then it is reduced", () => {
    expect(formatInches(193.675)).toBe("7 5/8");
    expect(formatInches(12.7)).toBe("1/2");
    expect(formatInches(25.4 * 1.25, 32)).toBe("1 1/4");
    expect(formatInches(25.4 * (1 + 3 / 32), 32)).toBe("1 3/32");
  });

  it("when the length falls between sixteenths, then each rounding goes its own way", () => {
    // 10 mm = 0.3937 in = 6.3 sixteenths.
    expect(formatInches(10, 16, "nearest")).toBe("3/8");
    expect(formatInches(10, 16, "down")).toBe("3/8");
    expect(formatInches(10, 16, "up")).toBe("7/16");
  });

  it("when the denominator changes, then the step changes with it", () => {
    // 10 mm = 3.15 eighths = 12.6 thirty-seconds.
    expect(formatInches(10, 8, "up")).toBe("1/2");
    expect(formatInches(10, 32, "nearest")).toBe("13/32");
    expect(formatInches(10, 32, "down")).toBe("3/8");
  });

  it("when a length is negative, then down means more negative and the sign is a true minus", () => {
    expect(formatInches(-10, 16, "down")).toBe("−7/16");
    expect(formatInches(-10, 16, "up")).toBe("−3/8");
  });

  it("when the length rounds to nothing, then it shows 0", () => {
    expect(formatInches(0)).toBe("0");
    expect(formatInches(0.1)).toBe("0");
  });

  it("when an A4 sheet is shown in inches, then it matches ISO 216's 210 × 297 mm", () => {
    // ISO 216: A4 = 210 × 297 mm. 210 / 25.4 = 8.2677 in; 297 / 25.4 = 11.6929 in.
    expect(210 / MM_PER_INCH).toBeCloseTo(8.2677, 4);
    expect(297 / MM_PER_INCH).toBeCloseTo(11.6929, 4);
    // To the nearest 1/64 in: 529.13/64 and 748.35/64, i.e. 8 17/64 × 11 11/16 in (approximately).
    expect(roundTo(210 / MM_PER_INCH, 1 / 64)).toBe(8 + 17 / 64);
    expect(roundTo(297 / MM_PER_INCH, 1 / 64)).toBe(11 + 11 / 16);
    // To the nearest 1/32 in the width is 8 9/32 (264.57/32); rounded down, 8 1/4.
    expect(formatInches(210, 32)).toBe("8 9/32");
    expect(formatInches(210, 32, "down")).toBe("8 1/4");
    expect(formatInches(297, 32)).toBe("11 11/16");
    expect(formatSize(210, 297, "in")).toBe("8 1/4 × 11 11/16 in");
  });
});

describe("formatMm, formatLength, formatSize, lengthInputValue", () => {
  it("when formatting mm, then it rounds to half millimetres with a true minus", () => {
    expect(formatMm(210)).toBe("210");
    expect(formatMm(210.26)).toBe("210.5");
    expect(formatMm(210.26, "down")).toBe("210");
    expect(formatMm(-3)).toBe("−3");
  });

  it("when formatting with a unit, then the unit is written after the number", () => {
    expect(formatLength(210, "mm")).toBe("210 mm");
    expect(formatLength(193.675, "in")).toBe("7 5/8 in");
    // ISO 216: A4 = 210 × 297 mm.
    expect(formatSize(210, 297, "mm")).toBe("210 × 297 mm");
  });

  it("when a stored length goes back into an input, then it parses back to the same length", () => {
    expect(lengthInputValue(null, "mm")).toBe("");
    expect(lengthInputValue(undefined, "in")).toBe("");
    expect(lengthInputValue(193.675, "in")).toBe("7 5/8");
    expect(lengthInputValue(210.04, "mm")).toBe("210");
    expect(lengthInputValue(12.34, "mm")).toBe("12.3");
    expect(mmOf(lengthInputValue(193.675, "in"), "in")).toBeCloseTo(193.675, 9);
  });
});
