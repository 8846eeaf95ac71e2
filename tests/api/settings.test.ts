import { beforeAll, describe, expect, it } from "vitest";
import { agentsFor, createTestApp, expectErrorShape, makeStudio, type Agent } from "../setup/test-app.ts";
import type { StudioSettings } from "../../shared/schemas/settings.ts";

const t = createTestApp();
let as: Record<"admin" | "framer" | "collector" | "registrar", Agent>;

const SETTINGS: StudioSettings = {
  studioName: "Tidewell & Marr",
  studioAddress: "Unit 4, Ropewalk Yard",
  studioContact: "01632 960 417",
  unit: "in",
  vocabulary: "mat",
  paperSize: "Letter",
  currency: "USD",
  // 5 mm overlap a side: common practice (no source); docs/trade.md §2 makes it a studio setting.
  minOverlapMm: 5,
  // 2 mm total rebate clearance: common practice (no source).
  rebateClearanceMm: 2,
  checkIntervalMonths: 18,
  checkIntervalOnLoanMonths: 6,
  framePresets: [{ label: "Stock 30 × 40 cm", widthMm: 300, heightMm: 400 }],
};

beforeAll(async () => {
  const s = await makeStudio(t);
  as = await agentsFor(t, s.people);
});

describe("GET /api/settings", () => {
  it("when nothing has been saved, then every role reads the defaults", async () => {
    for (const agent of Object.values(as)) {
      const res = await agent.get("/api/settings");
      expect(res.status).toBe(200);
      // Defaults: mm, UK vocabulary, A4 (ISO 216), GBP, 5 mm minimum overlap and 2 mm clearance (common practice (no source)).
      expect(res.body).toEqual({
        studioName: "My framing studio",
        studioAddress: null,
        studioContact: null,
        unit: "mm",
        vocabulary: "mount",
        paperSize: "A4",
        currency: "GBP",
        minOverlapMm: 5,
        rebateClearanceMm: 2,
        checkIntervalMonths: 24,
        checkIntervalOnLoanMonths: 12,
        framePresets: [],
        hasLogo: false,
      });
    }
  });
});

describe("PUT /api/settings", () => {
  it("when a framer saves settings, then it answers 403 and nothing changes", async () => {
    const res = await as.framer.put("/api/settings").send(SETTINGS);
    expect(res.status).toBe(403);
    expectErrorShape(res.body, "forbidden");
    expect((await as.framer.get("/api/settings")).body.studioName).toBe("My framing studio");
  });

  it("when a registrar or collector saves settings, then it answers 403", async () => {
    expect((await as.registrar.put("/api/settings").send(SETTINGS)).status).toBe(403);
    expect((await as.collector.put("/api/settings").send(SETTINGS)).status).toBe(403);
  });

  it("when the admin saves settings, then everyone reads them back", async () => {
    const res = await as.admin.put("/api/settings").send({ ...SETTINGS, currency: " usd " });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ...SETTINGS, hasLogo: false });
    expect((await as.collector.get("/api/settings")).body).toEqual({ ...SETTINGS, hasLogo: false });
  });

  it("when the admin saves twice, then the second save replaces the first", async () => {
    await as.admin.put("/api/settings").send(SETTINGS);
    const res = await as.admin.put("/api/settings").send({ ...SETTINGS, studioName: "Renamed studio", studioAddress: "" });
    expect(res.body).toMatchObject({ studioName: "Renamed studio", studioAddress: null });
  });

  it("when the currency is not an ISO 4217 code, then it answers 422 naming currency", async () => {
    const res = await as.admin.put("/api/settings").send({ ...SETTINGS, currency: "POUNDS" });
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields).toEqual({ currency: "Use an ISO 4217 currency code such as GBP." });
  });

  it("when the minimum overlap is out of range, then it answers 422 naming minOverlapMm", async () => {
    const res = await as.admin.put("/api/settings").send({ ...SETTINGS, minOverlapMm: 0.5 });
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields).toEqual({ minOverlapMm: "Minimum overlap must be at least 1 mm." });
  });

  it("when a field is missing, then it answers 422 naming it", async () => {
    const { unit: _u, ...noUnit } = SETTINGS;
    const res = await as.admin.put("/api/settings").send(noUnit);
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields).toEqual({ unit: "Choose mm or inches." });
  });
});
