import { beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, expectErrorShape, makeObject, makeStudio, type Agent } from "../setup/test-app.ts";
import { conditionReports, custodyReceipts, mountings, objects } from "../../server/db/schema.ts";
import { isCalendarDate } from "../../shared/domain/dates.ts";

// The Gregorian calendar (ISO 8601): 2026 is not a leap year (divisible by 4 only when not by 100 unless by 400),
// so 2026-02-29 is not a day; 2024-02-29 and 2000-02-29 are; 1900-02-29 is not.
const NOT_DAYS = ["2026-02-29", "2026-02-30", "2026-13-01", "2026-00-10", "2026-04-31", "0000-01-01", "1900-02-29", "2026-1-5", "tomorrow"];

describe("a date is a real day of the calendar", () => {
  it("knows the leap years and the months' lengths", () => {
    for (const d of ["2024-02-29", "2000-02-29", "2026-12-31", "2026-04-30"]) expect(isCalendarDate(d), d).toBe(true);
    for (const d of NOT_DAYS) expect(isCalendarDate(d), d).toBe(false);
  });
});

const t = createTestApp();
let framer: Agent;
let objectId: string;
let clientId: string;
beforeAll(async () => {
  const studio = await makeStudio(t);
  framer = await agentFor(t, studio.people.framer);
  clientId = studio.institution.id;
  objectId = makeObject(t.db, clientId);
});

const MOUNTING = (mountedOn: string) => ({
  reason: "first-mounting",
  mountedOn,
  data: {
    plan: { unit: "mm", sheet: { width: 210, height: 297 }, window: { all: { mode: "overlap", overlap: 5 } } },
    boards: { window: { grade: "museum", buffered: false, ply: 4 }, backing: { grade: "museum", buffered: false, ply: 4 } },
    attachment: { method: "corners", hinges: [] },
    glazing: { type: "uv-glass", thicknessMm: 2 },
    undoNotes: "Slide the sheet out of the corners.",
  },
});

describe("every write and filter refuses a day that does not exist, naming the field, and saves nothing", () => {
  const writes: [string, (d: string) => Promise<{ status: number; body: unknown }>, string, () => number][] = [
    [
      "object valuation date",
      (d) =>
        framer.post("/api/objects").send({
          objectNumber: `D-${Math.random().toString(36).slice(2, 8)}`,
          title: "Study",
          objectType: "print",
          sheetWidthMm: 210,
          sheetHeightMm: 297,
          clientId,
          status: "in-studio",
          valuationDate: d,
        }),
      "valuationDate",
      () => t.db.select().from(objects).all().length,
    ],
    ["mounting date", (d) => framer.post(`/api/objects/${objectId}/mountings`).send(MOUNTING(d)), "mountedOn", () => t.db.select().from(mountings).all().length],
    [
      "condition report date",
      (d) => framer.post(`/api/objects/${objectId}/condition`).send({ context: "arrival", reportDate: d, data: { overallRating: "good", summary: "Sound." } }),
      "reportDate",
      () => t.db.select().from(conditionReports).all().length,
    ],
    [
      "custody date",
      (d) => framer.post(`/api/objects/${objectId}/custody`).send({ kind: "intake", date: d, fromParty: "Owner", toParty: "Studio", condition: "Sound.", signedBy: "A. Framer" }),
      "date",
      () => t.db.select().from(custodyReceipts).all().length,
    ],
  ];
  it.each(writes)("when the %s is not a real day, then it answers 422 naming it", async (_what, send, field, count) => {
    const before = count();
    for (const d of NOT_DAYS) {
      const res = await send(d);
      expect(res.status, `${d}: ${JSON.stringify(res.body)}`).toBe(422);
      expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {}), d).toContain(field);
    }
    expect(count()).toBe(before);
  });

  const filters: [string, string][] = [
    ["/api/objects?checkDueBy=", "checkDueBy"],
    ["/api/condition?from=", "from"],
    ["/api/condition?to=", "to"],
    ["/api/mountings?from=", "from"],
    ["/api/custody/receipts?from=", "from"],
  ];
  it.each(filters)("when the filter %s… is not a real day, then it answers 422 naming it", async (url, field) => {
    for (const d of NOT_DAYS) {
      const res = await framer.get(`${url}${encodeURIComponent(d)}`);
      expect(res.status, `${url}${d}`).toBe(422);
      expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toContain(field);
    }
  });
});
