import { describe, expect, it } from "vitest";
import { ObjectCreateSchema, ObjectListQuerySchema, ObjectNumberSchema, ObjectUpdateSchema, type ObjectCreateInput } from "../../../shared/schemas/objects.ts";
import { issuesToFields } from "../../../shared/schemas/errors.ts";

// ISO 216: A4 = 210 × 297 mm.
const VALID: ObjectCreateInput = {
  objectNumber: "2026-0001",
  title: "Harbour wall, morning",
  objectType: "print",
  sheetWidthMm: 210,
  sheetHeightMm: 297,
  clientId: "client-1",
  status: "in-studio",
};

/** The `fields` map the API would answer with, or {} when the input is valid. */
function fieldsOf(input: unknown, schema: typeof ObjectCreateSchema | typeof ObjectUpdateSchema = ObjectCreateSchema) {
  const r = schema.safeParse(input);
  return r.success ? {} : issuesToFields(r.error.issues);
}

describe("ObjectCreateSchema", () => {
  it("when only the required fields are given, then the optional ones come back as null", () => {
    const o = ObjectCreateSchema.parse(VALID);
    expect(o.maker).toBeNull();
    expect(o.photoProcess).toBeNull();
    expect(o.borderLeftMm).toBeNull();
    expect(o.valuationMinor).toBeNull();
    expect(o.valuationCurrency).toBeNull();
    expect(o.sensitivities).toEqual([]);
  });

  it("when free text is blank or padded, then it is trimmed and blank becomes null", () => {
    const o = ObjectCreateSchema.parse({ ...VALID, title: "  Estuary  ", maker: "   ", medium: "" });
    expect(o.title).toBe("Estuary");
    expect(o.maker).toBeNull();
    expect(o.medium).toBeNull();
  });

  it("when the required fields are missing, then each is named by its path", () => {
    const fields = fieldsOf({});
    for (const key of ["objectNumber", "title", "objectType", "sheetWidthMm", "sheetHeightMm", "clientId", "status"]) {
      expect(fields, key).toHaveProperty(key);
    }
    expect(fields.objectType).toBe("Choose the object type.");
    expect(fields.clientId).toBe("Choose the owner.");
  });

  it("when the sheet size is zero or negative, then the field says it must be greater than 0", () => {
    expect(fieldsOf({ ...VALID, sheetWidthMm: 0 })).toEqual({ sheetWidthMm: "Sheet width must be greater than 0." });
    expect(fieldsOf({ ...VALID, sheetHeightMm: -1 })).toEqual({ sheetHeightMm: "Sheet height must be greater than 0." });
  });

  it("when a length is text rather than a number, then the field asks for a length", () => {
    expect(fieldsOf({ ...VALID, sheetWidthMm: "210" })).toEqual({ sheetWidthMm: "Sheet width: enter a length." });
  });

  it("when the sheet is larger than 3 m (the planner's bound, docs/trade.md §10), then it is refused", () => {
    expect(fieldsOf({ ...VALID, sheetWidthMm: 3001 })).toEqual({ sheetWidthMm: "Sheet width must be at most 3000 mm." });
  });

  it("when a border is negative, then that border is named", () => {
    expect(fieldsOf({ ...VALID, borderTopMm: -2 })).toEqual({ borderTopMm: "Top border cannot be negative." });
  });

  it("when the left and right borders reach across the sheet, then the right border is named", () => {
    expect(fieldsOf({ ...VALID, borderLeftMm: 105, borderRightMm: 105 })).toEqual({
      borderRightMm: "Left and right borders together must be narrower than the sheet.",
    });
    expect(fieldsOf({ ...VALID, borderLeftMm: 104.9, borderRightMm: 105 })).toEqual({});
  });

  it("when the top and bottom borders reach down the sheet, then the bottom border is named", () => {
    expect(fieldsOf({ ...VALID, borderTopMm: 297 })).toEqual({
      borderBottomMm: "Top and bottom borders together must be less than the sheet height.",
    });
  });

  it("when an insured value has no currency, then the currency is asked for", () => {
    expect(fieldsOf({ ...VALID, valuationMinor: 420000 })).toEqual({ valuationCurrency: "Give the currency of the insured value." });
    expect(fieldsOf({ ...VALID, valuationMinor: 420000, valuationCurrency: "" })).toEqual({
      valuationCurrency: "Give the currency of the insured value.",
    });
  });

  it("when the currency is lower case, then it is stored upper case", () => {
    const o = ObjectCreateSchema.parse({ ...VALID, valuationMinor: 420000, valuationCurrency: " gbp " });
    expect(o.valuationCurrency).toBe("GBP");
  });

  it("when the currency is not an ISO 4217 code, then the field says so", () => {
    expect(fieldsOf({ ...VALID, valuationMinor: 1, valuationCurrency: "ZZZ" })).toEqual({
      valuationCurrency: "Use an ISO 4217 currency code such as GBP, EUR or USD.",
    });
  });

  it("when the insured value has a fraction or is negative, then it is refused", () => {
    expect(fieldsOf({ ...VALID, valuationMinor: 10.5, valuationCurrency: "GBP" })).toEqual({
      valuationMinor: "Insured value is kept in whole minor units (e.g. pence or cents).",
    });
    expect(fieldsOf({ ...VALID, valuationMinor: -1, valuationCurrency: "GBP" })).toEqual({
      valuationMinor: "Insured value cannot be negative.",
    });
  });

  it("when the valuation date is not YYYY-MM-DD, then the field shows an example", () => {
    expect(fieldsOf({ ...VALID, valuationDate: "14/09/2025" })).toEqual({ valuationDate: "Use a real date such as 2026-11-30." });
  });

  it("when a photographic process is given for a print, then the process is named", () => {
    expect(fieldsOf({ ...VALID, photoProcess: "albumen" })).toEqual({
      photoProcess: "A photographic process only applies to a photograph.",
    });
    expect(fieldsOf({ ...VALID, objectType: "photograph", photoProcess: "albumen" })).toEqual({});
  });

  it("when a sensitivity is unknown, then its index in the list is named", () => {
    const fields = fieldsOf({ ...VALID, sensitivities: ["fragile", "damp"] });
    expect(Object.keys(fields)).toEqual(["sensitivities.1"]);
  });

  it("when the object number uses other characters, then it is refused", () => {
    expect(fieldsOf({ ...VALID, objectNumber: "2026#1" })).toEqual({ objectNumber: "Use letters, digits, spaces and . - / _ only." });
    expect(fieldsOf({ ...VALID, objectNumber: "-2026" })).toEqual({ objectNumber: "Use letters, digits, spaces and . - / _ only." });
  });

  it("when the object number has parts and separators, then it is accepted", () => {
    for (const n of ["2026-0001", "2026.14.3", "LOAN/2026/7", "A_1 b"]) expect(ObjectNumberSchema.safeParse(n).success, n).toBe(true);
  });

  it("when a field and a cross-field rule both fail, then both are named", () => {
    const fields = fieldsOf({ ...VALID, title: "", borderLeftMm: 200, borderRightMm: 200 });
    expect(Object.keys(fields).sort()).toEqual(["borderRightMm", "title"]);
  });
});

describe("ObjectUpdateSchema", () => {
  it("when the version is missing, then the update is refused naming version", () => {
    expect(Object.keys(fieldsOf(VALID, ObjectUpdateSchema))).toEqual(["version"]);
  });

  it("when the version is given, then the cross-field rules still apply", () => {
    expect(fieldsOf({ ...VALID, version: 1 }, ObjectUpdateSchema)).toEqual({});
    expect(fieldsOf({ ...VALID, version: 1, valuationMinor: 5 }, ObjectUpdateSchema)).toEqual({
      valuationCurrency: "Give the currency of the insured value.",
    });
    expect(Object.keys(fieldsOf({ ...VALID, version: 0 }, ObjectUpdateSchema))).toEqual(["version"]);
  });
});

describe("ObjectListQuerySchema", () => {
  it("when nothing is asked, then the list is by object number, ascending, 50 a page", () => {
    expect(ObjectListQuerySchema.parse({})).toEqual({ sort: "objectNumber", dir: "asc", page: 1, pageSize: 50 });
  });

  it("when the page comes from a query string, then it is coerced to a number", () => {
    expect(ObjectListQuerySchema.parse({ page: "3", pageSize: "10" })).toMatchObject({ page: 3, pageSize: 10 });
  });

  it("when the sort, page size or status is out of range, then that field is named", () => {
    const r = ObjectListQuerySchema.safeParse({ sort: "valuationMinor", pageSize: "500", status: "lost" });
    expect(r.success).toBe(false);
    expect(Object.keys(issuesToFields(r.error!.issues)).sort()).toEqual(["pageSize", "sort", "status"]);
  });
});
