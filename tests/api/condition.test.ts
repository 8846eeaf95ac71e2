import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import type { z } from "zod";
import { makeMounting, makePhoto } from "../../server/db/factories.ts";
import { accessMatrix, readRow, writeRow, type MatrixRow } from "../setup/access-matrix.ts";
import { agentFor, agentsFor, createTestApp, expectErrorShape, makeClient, makeObject, makePerson, makeStudio, signIn, type Agent, type Person } from "../setup/test-app.ts";
import { conditionReports, conditionRevisions, conditionTerms, events, objects, user } from "../../server/db/schema.ts";
import { DEMO_PASSWORD, seedDemo } from "../../server/db/seed.ts";
import { seedCondition } from "../../server/db/seed-condition.ts";
import { findObjectIdByNumber } from "../../server/features/objects/objects.repo.ts";
import { createConditionService } from "../../server/features/condition/condition.service.ts";
import type { ConditionDataInput, ConditionReport, FindingSchema } from "../../shared/schemas/condition.ts";
import type { ComparedFinding } from "../../shared/domain/condition.ts";
import type { HistoryEvent } from "../../shared/schemas/history.ts";
import type { SessionUser } from "../../shared/schemas/auth.ts";
import { at, first } from "../setup/lists.ts";

/** The studio's "now" in these tests: every signature is stamped with it. */
const NOW = new Date("2026-12-01T10:30:00.000Z");
const t = createTestApp({ clock: () => NOW });

type Role = "admin" | "framer" | "registrar" | "collector";
type FindingInput = z.input<typeof FindingSchema>;
let studio: Awaited<ReturnType<typeof makeStudio>>;
let as: Record<Role, Agent>;
let otherPrivate: string;

// Terms from the seeded vocabulary (docs/trade.md §14: Smithsonian MCI and conservators' glossaries; NEDCC Preservation 101 for photographs).
const FOXING: FindingInput = { id: "f-foxing", term: "foxing", location: { kind: "zone", zone: "bottom-centre" }, extent: "Scattered spots under 2 mm", severity: "slight" };
const TEAR: FindingInput = { id: "f-tear", term: "tear", location: { kind: "zone", zone: "edge-right" }, extent: "12 mm from the edge", severity: "moderate" };
const ABRASION: FindingInput = { id: "f-abrasion", term: "abrasion", location: { kind: "zone", zone: "top-left" }, extent: "10 × 6 mm", severity: "slight" };
const MOULD: FindingInput = { id: "f-mould", term: "mould", location: { kind: "zone", zone: "verso" }, extent: "30 × 20 mm", severity: "moderate" };
const INSECTS: FindingInput = { id: "f-insects", term: "insect damage", location: { kind: "zone", zone: "edge-bottom" }, extent: "Three small holes", severity: "moderate" };

const EXAMINER = { name: "Test framer", date: "2026-03-02" };
const OTHER_PARTY = { name: "Priya Anand-Coll", date: "2026-03-02", role: "Exhibitions, Eastharbour Gallery" };
const DATA: ConditionDataInput = {
  overallRating: "fair",
  summary: "Stable; light foxing in the lower margin and a short tear at the right edge.",
  findings: [FOXING, TEAR],
  signatures: { examiner: EXAMINER },
};
const with_ = (over: Partial<ConditionDataInput>): ConditionDataInput => ({ ...DATA, ...over });
const createBody = (data: ConditionDataInput = DATA, over: Record<string, unknown> = {}) => ({ context: "arrival", reportDate: "2026-03-02", data, ...over });

const reportRow = (id: string) => t.db.select().from(conditionReports).where(eq(conditionReports.id, id)).get()!;
const reportsOf = (objectId: string) => t.db.select().from(conditionReports).where(eq(conditionReports.objectId, objectId)).all();
const eventsOf = (objectId: string) => t.db.select().from(events).where(eq(events.objectId, objectId)).all();
const objectDates = (id: string) => t.db.select({ lastConditionOn: objects.lastConditionOn, checkDueOn: objects.checkDueOn }).from(objects).where(eq(objects.id, id)).get()!;
const cautionOf = (term: string) => t.db.select({ c: conditionTerms.caution }).from(conditionTerms).where(eq(conditionTerms.term, term)).get()!.c!;

async function draftOn(objectId: string, data: ConditionDataInput = DATA, over: Record<string, unknown> = {}, agent: Agent = as.framer): Promise<ConditionReport> {
  const res = await agent.post(`/api/objects/${objectId}/condition`).send(createBody(data, over));
  if (res.status !== 201) throw new Error(`Draft answered ${res.status}: ${JSON.stringify(res.body)}`);
  return res.body;
}
async function signedOn(objectId: string, data: ConditionDataInput = DATA, over: Record<string, unknown> = {}, agent: Agent = as.framer): Promise<ConditionReport> {
  const d = await draftOn(objectId, data, over, agent);
  const res = await agent.post(`/api/condition/${d.id}/sign`).send({ version: d.version });
  if (res.status !== 200) throw new Error(`Sign answered ${res.status}: ${JSON.stringify(res.body)}`);
  return res.body;
}

beforeAll(async () => {
  studio = await makeStudio(t);
  otherPrivate = makeClient(t.db, { kind: "private", name: "Basil Owner" }).id;
  as = await agentsFor(t, studio.people);
});

describe("the life cycle of a condition report", () => {
  let objectId: string;
  let report: ConditionReport;

  beforeAll(() => {
    objectId = makeObject(t.db, studio.collectorClient.id, { title: "Estuary at low water", objectType: "watercolour" });
  });

  it("when a framer writes a report, then it answers 201 with a draft at version 1 examined by the framer", async () => {
    const res = await as.framer.post(`/api/objects/${objectId}/condition`).send(createBody());
    expect(res.status).toBe(201);
    report = res.body;
    expect(report).toMatchObject({
      objectId,
      objectTitle: "Estuary at low water",
      status: "draft",
      context: "arrival",
      reportDate: "2026-03-02",
      examinerName: "Test framer",
      mountingId: null,
      rating: "fair",
      currentRevision: 1,
      signedAt: null,
      version: 1,
      cautions: [],
    });
    expect(report.current).toMatchObject({ revision: 1, correctionReason: null, createdByName: "Test framer" });
    expect(report.current.data.findings.map((f) => [f.id, f.term, f.severity, f.resolved])).toEqual([
      ["f-foxing", "foxing", "slight", false],
      ["f-tear", "tear", "moderate", false],
    ]);
    expect(reportRow(report.id)).toMatchObject({ examinerId: studio.people.framer.id, rating: "fair", unresolvedCount: 2 });
  });

  it("when the report is only a draft, then the object's condition dates stay empty and no event is written", () => {
    expect(objectDates(objectId)).toEqual({ lastConditionOn: null, checkDueOn: null });
    expect(eventsOf(objectId)).toEqual([]);
  });

  it("when the framer saves the draft with its version, then it is rewritten in place and the register columns follow", async () => {
    const data = with_({ overallRating: "poor", findings: [FOXING, { ...TEAR, severity: "severe" }, { ...ABRASION, resolved: true }] });
    const res = await as.framer.put(`/api/condition/${report.id}`).send({ ...createBody(data), version: 1 });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: report.id, status: "draft", version: 2, currentRevision: 1, rating: "poor" });
    expect(res.body.current.data.findings).toHaveLength(3);
    expect(reportRow(report.id)).toMatchObject({ rating: "poor", unresolvedCount: 2 });
    expect(t.db.select().from(conditionRevisions).where(eq(conditionRevisions.reportId, report.id)).all()).toHaveLength(1);
    report = res.body;
  });

  it("when a draft is saved with a stale version, then it answers 409 and the draft is unchanged", async () => {
    const res = await as.framer.put(`/api/condition/${report.id}`).send({ ...createBody(with_({ summary: "Late edit." })), version: 1 });
    expect(res.status).toBe(409);
    expectErrorShape(res.body, "conflict");
    const get = await as.framer.get(`/api/condition/${report.id}`);
    expect(get.body.version).toBe(2);
    expect(get.body.current.data.summary).toBe(DATA.summary);
  });

  it("when the framer signs the draft, then it is signed now by them and the object's condition dates follow it", async () => {
    const res = await as.framer.post(`/api/condition/${report.id}/sign`).send({ version: 2 });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: report.id, status: "signed", version: 3, currentRevision: 1, signedAt: NOW.toISOString() });
    expect(reportRow(report.id)).toMatchObject({ status: "signed", signedBy: studio.people.framer.id });
    // 24 months after the report: the studio's default interval.
    expect(objectDates(objectId)).toEqual({ lastConditionOn: "2026-03-02", checkDueOn: "2028-03-02" });
    report = res.body;
  });

  it("when the report is signed, then one condition-reported event tells the rating, findings and examiner", () => {
    const evs = eventsOf(objectId);
    expect(evs).toHaveLength(1);
    expect(evs[0]).toMatchObject({
      type: "condition-reported",
      actorName: "Test framer",
      summary: "Condition on arrival: poor — 3 findings (foxing, tear, abrasion). Examined by Test framer.",
    });
    expect(first(evs).at.toISOString()).toBe(NOW.toISOString());
    expect(first(evs).data).toMatchObject({ reportId: report.id, revision: 1, rating: "poor", findings: 3, unresolved: 2 });
  });

  it("when someone edits a signed report in place, then it answers 409 and the report is unchanged", async () => {
    const res = await as.framer.put(`/api/condition/${report.id}`).send({ ...createBody(with_({ summary: "Edited in place." })), version: report.version });
    expect(res.status).toBe(409);
    expect(expectErrorShape(res.body, "conflict").message).toMatch(/locked/);
    expect((await as.admin.get(`/api/condition/${report.id}`)).body).toEqual(report);
  });

  it("when a signed report is signed again, then it answers 409", async () => {
    const res = await as.framer.post(`/api/condition/${report.id}/sign`).send({ version: report.version });
    expect(res.status).toBe(409);
    expectErrorShape(res.body, "conflict");
    expect(eventsOf(objectId)).toHaveLength(1);
  });

  it("when the database is asked to change a signed report's revision or unsign it, then it refuses", () => {
    expect(() => t.database.sqlite.prepare("UPDATE condition_revisions SET data = '{}' WHERE report_id = ?").run(report.id)).toThrow(/cannot be changed/);
    expect(() => t.database.sqlite.prepare("DELETE FROM condition_revisions WHERE report_id = ?").run(report.id)).toThrow(/cannot be deleted/);
    expect(() => t.database.sqlite.prepare("UPDATE condition_reports SET status = 'draft' WHERE id = ?").run(report.id)).toThrow(/draft/);
    expect(() => t.database.sqlite.prepare("DELETE FROM condition_reports WHERE id = ?").run(report.id)).toThrow();
    expect(reportRow(report.id).status).toBe("signed");
  });

  it("when a signed report is corrected with a reason, then revision 2 holds the correction and the register columns follow it", async () => {
    const data = { ...report.current.data, overallRating: "fair" as const, findings: [FOXING, { ...TEAR, severity: "moderate" as const }, { ...ABRASION, resolved: true }] };
    const res = await as.framer
      .post(`/api/condition/${report.id}/corrections`)
      .send({ version: report.version, correctionReason: "The tear was measured again: moderate, not severe.", data });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ id: report.id, status: "signed", currentRevision: 2, version: report.version + 1, rating: "fair" });
    expect(res.body.current).toMatchObject({ revision: 2, correctionReason: "The tear was measured again: moderate, not severe.", createdByName: "Test framer" });
    expect(reportRow(report.id)).toMatchObject({ rating: "fair", unresolvedCount: 2 });
    // The report's date did not change, so neither do the object's condition dates.
    expect(objectDates(objectId)).toEqual({ lastConditionOn: "2026-03-02", checkDueOn: "2028-03-02" });
    report = res.body;
  });

  it("when a report is corrected, then a condition-reported event says corrected and carries the changes", () => {
    const ev = eventsOf(objectId).at(-1)!;
    expect(ev.type).toBe("condition-reported");
    expect(ev.summary).toContain("corrected");
    expect(ev.summary).toContain("The tear was measured again");
    const changes = (ev.data as { changes: { path: string }[] }).changes.map((c) => c.path).sort();
    expect(changes).toEqual(["findings.1.severity", "overallRating"]);
  });

  it("when the revisions are read, then both stay readable and the second lists the changed paths", async () => {
    const res = await as.collector.get(`/api/condition/${report.id}/revisions`);
    expect(res.status).toBe(200);
    const [r1, r2] = res.body.items;
    expect(res.body.items).toHaveLength(2);
    expect(r1).toMatchObject({ revision: 1, correctionReason: null, changes: [] });
    expect(r1.data.overallRating).toBe("poor");
    expect(r2.changes).toContainEqual({ path: "findings.1.severity", before: "severe", after: "moderate" });
    expect(r2.changes).toContainEqual({ path: "overallRating", before: "poor", after: "fair" });
  });

  it("when a correction changes nothing, then it answers 422 and no revision is added", async () => {
    const res = await as.framer.post(`/api/condition/${report.id}/corrections`).send({ version: report.version, correctionReason: "Checking.", data: report.current.data });
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields).toHaveProperty("data");
    expect(reportRow(report.id).currentRevision).toBe(2);
  });

  it("when a correction gives no reason, then it answers 422 naming correctionReason", async () => {
    const res = await as.framer.post(`/api/condition/${report.id}/corrections`).send({ version: report.version, correctionReason: "  ", data: with_({ summary: "Other." }) });
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["correctionReason"]);
  });

  it("when a correction starts from a stale version, then it answers 409 and no revision is added", async () => {
    const res = await as.admin
      .post(`/api/condition/${report.id}/corrections`)
      .send({ version: report.version - 1, correctionReason: "Stale tab.", data: with_({ summary: "From a stale tab." }) });
    expect(res.status).toBe(409);
    expectErrorShape(res.body, "conflict");
    expect(reportRow(report.id).currentRevision).toBe(2);
  });

  it("when a draft is sent as a correction, then it answers 409: drafts are edited directly", async () => {
    const d = await draftOn(objectId, DATA, { context: "periodic-check", reportDate: "2026-09-01" });
    const res = await as.framer.post(`/api/condition/${d.id}/corrections`).send({ version: d.version, correctionReason: "Not yet.", data: with_({ summary: "Other." }) });
    expect(res.status).toBe(409);
    expectErrorShape(res.body, "conflict");
  });

  it("when the object's history is read, then both events are there and the chain verifies", async () => {
    const res = await as.collector.get(`/api/objects/${objectId}/history`);
    expect(res.status).toBe(200);
    const items: HistoryEvent[] = res.body.items;
    expect(items.map((e) => e.type)).toEqual(["condition-reported", "condition-reported"]);
    expect(first(items).summary).toContain("corrected");
    expect(at(items, 1).summary).toMatch(/^Condition on arrival: poor/);
    const verify = await as.admin.get(`/api/objects/${objectId}/history/verify`);
    expect(verify.body).toEqual({ ok: true, checked: 2 });
  });

  it("when the report or object does not exist, then it answers 404", async () => {
    expect((await as.framer.post("/api/objects/no-such-object/condition").send(createBody())).status).toBe(404);
    expect((await as.framer.get("/api/objects/no-such-object/condition")).status).toBe(404);
    for (const path of ["/api/condition/no-such-report", "/api/condition/no-such-report/revisions"]) {
      const res = await as.framer.get(path);
      expect(res.status, path).toBe(404);
      expectErrorShape(res.body, "not_found");
    }
    expect((await as.framer.post("/api/condition/no-such-report/sign").send({ version: 1 })).status).toBe(404);
  });

  it("when anyone sends DELETE for a report, then there is no such route (404) and the report stays", async () => {
    const res = await as.admin.delete(`/api/condition/${report.id}`);
    expect(res.status).toBe(404);
    expect(reportRow(report.id).status).toBe("signed");
  });
});

describe("the summary written to the history", () => {
  it("when a report with foxing, a tear and mould is signed, then the event reads like the brief's example and names no value", async () => {
    const objectId = makeObject(t.db, studio.institution.id, { valuationMinor: 420000, valuationCurrency: "GBP" });
    await signedOn(objectId, with_({ findings: [FOXING, TEAR, MOULD] }), {}, as.registrar);
    const ev = first(eventsOf(objectId));
    expect(ev.summary).toBe("Condition on arrival: fair — 3 findings (foxing, tear, mould). Examined by Test registrar.");
    expect(JSON.stringify(ev)).not.toMatch(/4200|valuation/i);
  });

  it("when a report has no findings, then it says so", async () => {
    const objectId = makeObject(t.db, studio.institution.id);
    await signedOn(objectId, with_({ overallRating: "good", findings: [] }), { context: "periodic-check" });
    expect(first(eventsOf(objectId)).summary).toBe("Condition at a periodic check: good — no findings. Examined by Test framer.");
  });
});

describe("the rating rule (Spectrum 5.0 Condition: the overall rating is the worst finding's)", () => {
  const tooGood = with_({ overallRating: "fair", findings: [FOXING, { ...TEAR, severity: "severe" }] });

  it("when a report rates the object better than its worst finding, then it answers 422 at data.overallRating", async () => {
    const objectId = makeObject(t.db, studio.institution.id);
    const res = await as.framer.post(`/api/objects/${objectId}/condition`).send(createBody(tooGood));
    expect(res.status).toBe(422);
    const fields = expectErrorShape(res.body, "validation_failed").fields ?? {};
    expect(Object.keys(fields)).toEqual(["data.overallRating"]);
    expect(fields["data.overallRating"]).toContain("poor");
    expect(reportsOf(objectId)).toEqual([]);
  });

  it("when a critical finding is rated anything but unstable, then it is refused", async () => {
    const objectId = makeObject(t.db, studio.institution.id);
    const res = await as.framer.post(`/api/objects/${objectId}/condition`).send(createBody(with_({ overallRating: "poor", findings: [{ ...TEAR, severity: "critical" }] })));
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["data.overallRating"]);
  });

  it("when a draft update or a correction breaks the rule, then it answers 422 and nothing changes", async () => {
    const objectId = makeObject(t.db, studio.institution.id);
    const d = await draftOn(objectId);
    const put = await as.framer.put(`/api/condition/${d.id}`).send({ ...createBody(tooGood), version: d.version });
    expect(put.status).toBe(422);
    expect(Object.keys(expectErrorShape(put.body, "validation_failed").fields ?? {})).toEqual(["data.overallRating"]);
    expect(reportRow(d.id).version).toBe(d.version);
    const s = await signedOn(objectId);
    const fix = await as.framer.post(`/api/condition/${s.id}/corrections`).send({ version: s.version, correctionReason: "Worse tear.", data: tooGood });
    expect(fix.status).toBe(422);
    expect(reportRow(s.id).currentRevision).toBe(1);
  });

  it("when a report rates the object worse than its findings require, then it is accepted", async () => {
    const r = await draftOn(makeObject(t.db, studio.institution.id), with_({ overallRating: "unstable", findings: [FOXING] }));
    expect(r.rating).toBe("unstable");
  });
});

describe("signing", () => {
  it("when the examiner has not signed, then signing answers 422 at data.signatures.examiner and the report stays a draft", async () => {
    const objectId = makeObject(t.db, studio.institution.id);
    const d = await draftOn(objectId, with_({ signatures: {} }));
    const res = await as.framer.post(`/api/condition/${d.id}/sign`).send({ version: d.version });
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["data.signatures.examiner"]);
    expect(reportRow(d.id).status).toBe("draft");
    expect(objectDates(objectId).lastConditionOn).toBeNull();
    expect(eventsOf(objectId)).toEqual([]);
  });

  it.each(["loan-out", "loan-return"])("when a %s report has only the examiner's signature, then it answers 422 naming data.signatures.otherParty", async (context) => {
    const d = await draftOn(makeObject(t.db, studio.institution.id), DATA, { context });
    const res = await as.framer.post(`/api/condition/${d.id}/sign`).send({ version: d.version });
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["data.signatures.otherParty"]);
    expect(reportRow(d.id).status).toBe("draft");
  });

  it("when a loan report is signed by both parties, then it is signed and the event names the other party", async () => {
    const objectId = makeObject(t.db, studio.institution.id);
    const s = await signedOn(objectId, with_({ signatures: { examiner: EXAMINER, otherParty: OTHER_PARTY } }), { context: "loan-out" });
    expect(s.status).toBe("signed");
    expect(s.current.data.signatures.otherParty).toEqual(OTHER_PARTY);
    expect(first(eventsOf(objectId)).summary).toBe(
      "Condition at loan out: fair — 2 findings (foxing, tear). Examined by Test framer. Signed for the other party by Priya Anand-Coll.",
    );
  });

  it("when a report outside a loan has only the examiner's signature, then it signs", async () => {
    for (const context of ["arrival", "periodic-check", "incident", "claim"]) {
      const s = await signedOn(makeObject(t.db, studio.institution.id), DATA, { context });
      expect(s.status, context).toBe("signed");
    }
  });

  it("when a signature's date is not a real day, then even the draft is refused, at that date", async () => {
    const res = await as.framer
      .post(`/api/objects/${makeObject(t.db, studio.institution.id)}/condition`)
      .send(createBody(with_({ signatures: { examiner: { name: "Test framer", date: "2026-02-30" } } })));
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["data.signatures.examiner.date"]);
  });

  it("when signing starts from a stale version, then it answers 409 and the report stays a draft", async () => {
    const d = await draftOn(makeObject(t.db, studio.institution.id));
    await as.framer.put(`/api/condition/${d.id}`).send({ ...createBody(with_({ summary: "Second thoughts." })), version: d.version });
    const res = await as.framer.post(`/api/condition/${d.id}/sign`).send({ version: d.version });
    expect(res.status).toBe(409);
    expectErrorShape(res.body, "conflict");
    expect(reportRow(d.id).status).toBe("draft");
  });

  it("when a correction of a loan report drops the other party's signature, then it answers 422", async () => {
    const s = await signedOn(makeObject(t.db, studio.institution.id), with_({ signatures: { examiner: EXAMINER, otherParty: OTHER_PARTY } }), { context: "loan-return" });
    const res = await as.framer
      .post(`/api/condition/${s.id}/corrections`)
      .send({ version: s.version, correctionReason: "Tidy.", data: with_({ signatures: { examiner: EXAMINER } }) });
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["data.signatures.otherParty"]);
    expect(reportRow(s.id).currentRevision).toBe(1);
  });

  it("when a registrar signs a report of their institution's object, then it is signed by them", async () => {
    const d = await draftOn(makeObject(t.db, studio.institution.id));
    const res = await as.registrar.post(`/api/condition/${d.id}/sign`).send({ version: d.version });
    expect(res.status).toBe(200);
    expect(reportRow(d.id).signedBy).toBe(studio.people.registrar.id);
  });
});

describe("the object's condition dates", () => {
  it("when an earlier report is signed after a later one, then the last condition date stays on the later one", async () => {
    const objectId = makeObject(t.db, studio.collectorClient.id);
    await signedOn(objectId, DATA, { context: "periodic-check", reportDate: "2026-10-05" });
    expect(objectDates(objectId)).toEqual({ lastConditionOn: "2026-10-05", checkDueOn: "2028-10-05" });
    await signedOn(objectId, DATA, { context: "arrival", reportDate: "2025-04-01" });
    expect(objectDates(objectId)).toEqual({ lastConditionOn: "2026-10-05", checkDueOn: "2028-10-05" });
  });

  it("when the object is on loan, then the next check falls due after the loan interval (12 months by default)", async () => {
    const objectId = makeObject(t.db, studio.institution.id, { status: "on-loan" });
    await signedOn(objectId, with_({ signatures: { examiner: EXAMINER, otherParty: OTHER_PARTY } }), { context: "loan-out", reportDate: "2026-08-26" });
    expect(objectDates(objectId)).toEqual({ lastConditionOn: "2026-08-26", checkDueOn: "2027-08-26" });
  });

  it("when the object was mounted after the report's date, then the next check counts from the mounting, as mountings do", async () => {
    const objectId = makeObject(t.db, studio.institution.id);
    t.db.update(objects).set({ lastMountedOn: "2027-01-15" }).where(eq(objects.id, objectId)).run();
    await signedOn(objectId, DATA, { reportDate: "2026-06-01" });
    expect(objectDates(objectId)).toEqual({ lastConditionOn: "2026-06-01", checkDueOn: "2029-01-15" });
  });

  it("when the admin changes the studio's intervals, then the next signing uses them, month ends included", async () => {
    const before = (await as.admin.get("/api/settings")).body;
    try {
      const put = await as.admin.put("/api/settings").send({ ...before, checkIntervalMonths: 1, checkIntervalOnLoanMonths: 6 });
      expect(put.status).toBe(200);
      const inStudio = makeObject(t.db, studio.institution.id);
      await signedOn(inStudio, DATA, { reportDate: "2026-01-31" });
      // 31 January + 1 month: February has no 31st, so its last day.
      expect(objectDates(inStudio)).toEqual({ lastConditionOn: "2026-01-31", checkDueOn: "2026-02-28" });
      const onLoan = makeObject(t.db, studio.institution.id, { status: "on-loan" });
      await signedOn(onLoan, DATA, { reportDate: "2026-08-31", context: "periodic-check" });
      expect(objectDates(onLoan)).toEqual({ lastConditionOn: "2026-08-31", checkDueOn: "2027-02-28" });
    } finally {
      expect((await as.admin.put("/api/settings").send(before)).status).toBe(200);
    }
  });
});

describe("what a report may refer to", () => {
  let objectId: string;
  beforeAll(() => {
    objectId = makeObject(t.db, studio.institution.id);
  });
  const refused = async (body: unknown, agent: Agent = as.framer) => {
    const before = reportsOf(objectId).length;
    const res = await agent.post(`/api/objects/${objectId}/condition`).send(body as object);
    expect(res.status).toBe(422);
    expect(reportsOf(objectId)).toHaveLength(before);
    return expectErrorShape(res.body, "validation_failed").fields ?? {};
  };

  it("when the mounting is one of the same object, then the report refers to it", async () => {
    const m = makeMounting(t.db, studio.people.framer, objectId, { mountedOn: "2026-01-10" }).id;
    const r = await draftOn(objectId, DATA, { context: "after-mounting", mountingId: m });
    expect(r.mountingId).toBe(m);
  });

  it("when the mounting belongs to another object or does not exist, then it answers 422 at mountingId", async () => {
    const elsewhere = makeMounting(t.db, studio.people.framer, makeObject(t.db, studio.institution.id), { mountedOn: "2026-01-10" }).id;
    expect(Object.keys(await refused(createBody(DATA, { mountingId: elsewhere })))).toEqual(["mountingId"]);
    expect(Object.keys(await refused(createBody(DATA, { mountingId: "no-such-mounting" })))).toEqual(["mountingId"]);
  });

  it("when a registrar names a draft mounting, then it answers 422 as if it did not exist; the studio may name it", async () => {
    const draft = makeMounting(t.db, studio.people.framer, objectId, { mountedOn: "2026-01-10", status: "draft" }).id;
    const fields = await refused(createBody(DATA, { mountingId: draft }), as.registrar);
    expect(fields).toEqual({ mountingId: "Choose a mounting record of this object." });
    expect((await draftOn(objectId, DATA, { mountingId: draft })).mountingId).toBe(draft);
  });

  it("when the photos are the object's own, then the report keeps them, with a marker on one", async () => {
    const [p1, p2] = [makePhoto(t.db, objectId), makePhoto(t.db, objectId)];
    const marker: FindingInput = { ...TEAR, location: { kind: "marker", photoId: p2, x: 0.92, y: 0.4 } };
    const r = await draftOn(objectId, with_({ photoIds: [p1, p2], findings: [FOXING, marker] }));
    expect(r.current.data.photoIds).toEqual([p1, p2]);
    expect(at(r.current.data.findings, 1).location).toEqual({ kind: "marker", photoId: p2, x: 0.92, y: 0.4 });
  });

  it("when a photo is another object's or unknown, then it answers 422 at data.photoIds.N", async () => {
    const own = makePhoto(t.db, objectId);
    const foreign = makePhoto(t.db, makeObject(t.db, studio.institution.id));
    const fields = await refused(createBody(with_({ photoIds: [own, foreign, "no-such-photo"] })));
    expect(Object.keys(fields).sort()).toEqual(["data.photoIds.1", "data.photoIds.2"]);
  });

  it("when a marker is on a photo that is not part of the report, then it answers 422 at the finding's location", async () => {
    const p = makePhoto(t.db, objectId);
    const fields = await refused(createBody(with_({ findings: [{ ...TEAR, location: { kind: "marker", photoId: p, x: 0.5, y: 0.5 } }] })));
    expect(Object.keys(fields)).toEqual(["data.findings.0.location.photoId"]);
  });

  it("when a finding's term is not in the vocabulary, then it answers 422 at data.findings.N.term", async () => {
    const fields = await refused(createBody(with_({ findings: [FOXING, { ...TEAR, term: "smudgy bit" }] })));
    expect(Object.keys(fields)).toEqual(["data.findings.1.term"]);
    expect(fields["data.findings.1.term"]).toContain("smudgy bit");
  });

  it("when a print's finding uses a photograph term, then it is refused; a photograph may use both lists", async () => {
    const fields = await refused(createBody(with_({ findings: [{ ...FOXING, term: "silver mirroring" }] })));
    expect(Object.keys(fields)).toEqual(["data.findings.0.term"]);
    const photo = makeObject(t.db, studio.institution.id, { objectType: "photograph", photoProcess: "gelatin-silver" });
    const r = await draftOn(photo, with_({ findings: [{ ...FOXING, term: "silver mirroring" }, TEAR] }));
    expect(r.current.data.findings.map((f) => f.term)).toEqual(["silver mirroring", "tear"]);
  });

  it("when a term is typed in another case, then the report keeps the vocabulary's spelling", async () => {
    const r = await draftOn(objectId, with_({ findings: [{ ...FOXING, term: "Foxing" }] }));
    expect(first(r.current.data.findings).term).toBe("foxing");
  });

  it("when a term has been retired, then a new report may not use it, but a signed report that has it keeps it through a correction", async () => {
    const made = await as.admin.post("/api/condition-terms").send({ list: "paper", term: "bloom", caution: null, active: true });
    expect(made.status).toBe(201);
    const bloom: FindingInput = { ...FOXING, id: "f-bloom", term: "bloom" };
    const s = await signedOn(objectId, with_({ findings: [bloom] }));
    expect((await as.admin.put(`/api/condition-terms/${made.body.id}`).send({ ...made.body, active: false })).status).toBe(200);
    const fields = await refused(createBody(with_({ findings: [bloom] })));
    expect(fields["data.findings.0.term"]).toMatch(/retired/);
    const fix = await as.framer
      .post(`/api/condition/${s.id}/corrections`)
      .send({ version: s.version, correctionReason: "Extent measured.", data: with_({ findings: [{ ...bloom, extent: "Whole lower half" }] }) });
    expect(fix.status).toBe(201);
    expect(fix.body.current.data.findings[0].term).toBe("bloom");
  });

  it("when the date or context is wrong, then it answers 422 naming them", async () => {
    expect(Object.keys(await refused(createBody(DATA, { reportDate: "2026-02-30" })))).toEqual(["reportDate"]);
    expect(Object.keys(await refused(createBody(DATA, { context: "a whim", reportDate: "2 March 2026" }))).sort()).toEqual(["context", "reportDate"]);
  });

  it("when two findings share an id or a severity is missing, then the contract names the finding", async () => {
    expect(Object.keys(await refused(createBody(with_({ findings: [FOXING, { ...TEAR, id: FOXING.id }] }))))).toEqual(["data.findings.1.id"]);
    const { severity: _s, ...noSeverity } = TEAR;
    expect(Object.keys(await refused(createBody(with_({ findings: [noSeverity as FindingInput] }))))).toEqual(["data.findings.0.severity"]);
  });
});

describe("cautions (docs/trade.md §12; NEDCC leaflet 3.8 and US CDC for mould)", () => {
  let objectId: string;
  beforeAll(() => {
    objectId = makeObject(t.db, studio.collectorClient.id);
  });

  it("when a report finds mould, then it carries the mould handling caution (gloves and a respirator)", async () => {
    const r = await signedOn(objectId, with_({ findings: [FOXING, MOULD] }));
    expect(r.cautions).toEqual([cautionOf("mould")]);
    expect(r.cautions[0]).toMatch(/nitrile gloves/);
    expect(r.cautions[0]).toMatch(/N95/);
    expect((await as.collector.get(`/api/condition/${r.id}`)).body.cautions).toEqual([cautionOf("mould")]);
  });

  it("when a report finds mould twice and insect damage, then each caution appears once, in the findings' order", async () => {
    const r = await draftOn(objectId, with_({ findings: [INSECTS, MOULD, { ...MOULD, id: "f-mould-2", location: { kind: "zone", zone: "centre" } }] }));
    expect(r.cautions).toEqual([cautionOf("insect damage"), cautionOf("mould")]);
    expect(r.cautions[0]).toMatch(/isolate and seal/i);
  });

  it("when no finding's term has a caution, then there are none", async () => {
    expect((await draftOn(objectId)).cautions).toEqual([]);
  });

  it("when the object's reports are listed, then each carries its own cautions", async () => {
    const res = await as.framer.get(`/api/objects/${objectId}/condition`);
    expect(res.status).toBe(200);
    const withMould = res.body.items.filter((r: ConditionReport) => r.cautions.includes(cautionOf("mould")));
    expect(withMould).toHaveLength(2);
  });
});

describe("listing an object's reports", () => {
  it("when an object has several reports, then they come newest first by report date, then by when they were written", async () => {
    const objectId = makeObject(t.db, studio.collectorClient.id);
    const a = await signedOn(objectId, DATA, { reportDate: "2026-03-02" });
    const b = await signedOn(objectId, DATA, { reportDate: "2026-11-19", context: "periodic-check" });
    const c = await signedOn(objectId, DATA, { reportDate: "2026-11-19", context: "incident" });
    const d = await draftOn(objectId, DATA, { reportDate: "2026-05-01", context: "before-mounting" });
    const studioView = await as.framer.get(`/api/objects/${objectId}/condition`);
    expect(studioView.body.items.map((r: ConditionReport) => r.id)).toEqual([c.id, b.id, d.id, a.id]);
    const collectorView = await as.collector.get(`/api/objects/${objectId}/condition`);
    expect(collectorView.body.items.map((r: ConditionReport) => r.id)).toEqual([c.id, b.id, a.id]);
  });

  it("when a registrar lists their institution's object, then drafts are there too", async () => {
    const objectId = makeObject(t.db, studio.institution.id);
    const d = await draftOn(objectId);
    const res = await as.registrar.get(`/api/objects/${objectId}/condition`);
    expect(res.body.items.map((r: ConditionReport) => [r.id, r.status])).toEqual([[d.id, "draft"]]);
  });
});

describe("comparing two reports", () => {
  let objectId: string;
  let arrival: ConditionReport;
  let check: ConditionReport;

  beforeAll(async () => {
    objectId = makeObject(t.db, studio.collectorClient.id);
    arrival = await signedOn(objectId, DATA, { reportDate: "2026-03-02" });
    check = await signedOn(objectId, with_({ overallRating: "poor", findings: [FOXING, { ...TEAR, severity: "severe" }, ABRASION] }), {
      context: "periodic-check",
      reportDate: "2026-11-19",
    });
  });

  const byTerm = (fs: ComparedFinding[]) => Object.fromEntries(fs.map((f) => [(f.after ?? f.before)!.term, f.status]));

  it("when a later report adds a finding and a tear's severity rose, then the abrasion is new, the tear worsened and the foxing unchanged", async () => {
    const res = await as.collector.get(`/api/condition/compare?from=${arrival.id}&to=${check.id}`);
    expect(res.status).toBe(200);
    expect(res.body.earlier.id).toBe(arrival.id);
    expect(res.body.later.id).toBe(check.id);
    expect(byTerm(res.body.findings)).toEqual({ foxing: "unchanged", tear: "worsened", abrasion: "new" });
    const tear = res.body.findings.find((f: ComparedFinding) => f.status === "worsened");
    expect([tear.before.severity, tear.after.severity]).toEqual(["moderate", "severe"]);
  });

  it("when the reports are asked for the other way round, then earlier and later still follow their dates", async () => {
    const res = await as.framer.get(`/api/condition/compare?from=${check.id}&to=${arrival.id}`);
    expect(res.status).toBe(200);
    expect([res.body.earlier.id, res.body.later.id]).toEqual([arrival.id, check.id]);
    expect(byTerm(res.body.findings)).toEqual({ foxing: "unchanged", tear: "worsened", abrasion: "new" });
  });

  it("when a finding of the earlier report is gone from the later one, then it is no longer seen", async () => {
    const later = await signedOn(objectId, with_({ overallRating: "good", findings: [FOXING] }), { context: "periodic-check", reportDate: "2027-06-01" });
    const res = await as.framer.get(`/api/condition/compare?from=${arrival.id}&to=${later.id}`);
    expect(byTerm(res.body.findings)).toEqual({ foxing: "unchanged", tear: "no-longer-seen" });
  });

  it("when the reports are of two objects, then it answers 422", async () => {
    const other = await signedOn(makeObject(t.db, studio.collectorClient.id));
    const res = await as.framer.get(`/api/condition/compare?from=${arrival.id}&to=${other.id}`);
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["to"]);
  });

  it("when the same report is given twice or an id is missing, then it answers 422", async () => {
    expect((await as.framer.get(`/api/condition/compare?from=${arrival.id}&to=${arrival.id}`)).status).toBe(422);
    const res = await as.framer.get(`/api/condition/compare?from=${arrival.id}`);
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(["to"]);
  });

  it("when one report is a draft the collector cannot see, or does not exist, then it answers 404", async () => {
    const draft = await draftOn(objectId, DATA, { context: "periodic-check", reportDate: "2027-09-01" });
    const res = await as.collector.get(`/api/condition/compare?from=${arrival.id}&to=${draft.id}`);
    expect(res.status).toBe(404);
    expectErrorShape(res.body, "not_found");
    expect((await as.framer.get(`/api/condition/compare?from=${arrival.id}&to=${draft.id}`)).status).toBe(200);
    expect((await as.framer.get(`/api/condition/compare?from=${arrival.id}&to=no-such-report`)).status).toBe(404);
  });
});

describe("the condition register", () => {
  // Reports dated in 2031, so the filters can be checked against this block's rows alone.
  const IN_2031 = "from=2031-01-01&to=2031-12-31";
  let examiner: Person;
  let examinerAgent: Agent;
  let own: string; // the collector's object
  let inst: string; // the registrar's institution's object
  let otherInst: string;
  const r = {} as Record<"ownArrival" | "ownDraft" | "instCheck" | "instResolved" | "otherIncident", ConditionReport>;

  beforeAll(async () => {
    examiner = await makePerson(t, "framer");
    t.db.update(user).set({ name: "Register Examiner" }).where(eq(user.id, examiner.id)).run();
    examinerAgent = await agentFor(t, examiner);
    own = makeObject(t.db, studio.collectorClient.id, { objectNumber: "REG-0001", title: "Register study one" });
    inst = makeObject(t.db, studio.institution.id, { objectNumber: "REG-0002", title: "Register study two" });
    otherInst = makeObject(t.db, studio.otherInstitution.id, { objectNumber: "REG-0003", title: "Register study three" });
    r.ownArrival = await signedOn(own, with_({ overallRating: "fair" }), { reportDate: "2031-01-10" }, examinerAgent);
    r.ownDraft = await draftOn(own, with_({ overallRating: "good", findings: [FOXING] }), { reportDate: "2031-02-01", context: "periodic-check" });
    r.instCheck = await signedOn(inst, with_({ overallRating: "poor", findings: [{ ...TEAR, severity: "severe" }] }), { reportDate: "2031-03-05", context: "periodic-check" });
    r.instResolved = await signedOn(
      inst,
      with_({ overallRating: "good", findings: [{ ...FOXING, resolved: true }] }),
      { reportDate: "2031-04-01", context: "after-mounting" },
      examinerAgent,
    );
    r.otherIncident = await signedOn(otherInst, with_({ overallRating: "unstable", findings: [{ ...TEAR, severity: "critical" }] }), {
      reportDate: "2031-05-20",
      context: "incident",
    });
    // The signings above set each object's check date; pin them so the due-by filter has clear answers.
    t.db.update(objects).set({ checkDueOn: "2031-06-30" }).where(eq(objects.id, own)).run();
    t.db.update(objects).set({ checkDueOn: "2033-03-05" }).where(eq(objects.id, inst)).run();
    t.db.update(objects).set({ checkDueOn: "2031-12-31" }).where(eq(objects.id, otherInst)).run();
  });

  const ids = (res: { body: { items: { id: string }[] } }) => res.body.items.map((i) => i.id);

  it("when the studio opens the register, then every report is there newest first, drafts included, with the register's columns", async () => {
    const res = await as.framer.get(`/api/condition?${IN_2031}`);
    expect(res.status).toBe(200);
    expect(ids(res)).toEqual([r.otherIncident.id, r.instResolved.id, r.instCheck.id, r.ownDraft.id, r.ownArrival.id]);
    expect(res.body).toMatchObject({ total: 5, page: 1, pageSize: 50 });
    expect(res.body.items[0]).toEqual({
      id: r.otherIncident.id,
      objectId: otherInst,
      objectNumber: "REG-0003",
      objectTitle: "Register study three",
      reportDate: "2031-05-20",
      context: "incident",
      rating: "unstable",
      status: "signed",
      examinerName: "Test framer",
      unresolvedCount: 1,
      checkDueOn: "2031-12-31",
    });
  });

  it("when a registrar opens the register, then only their institution's reports are there, drafts included", async () => {
    const d = await draftOn(inst, DATA, { reportDate: "2031-06-01" });
    const res = await as.registrar.get(`/api/condition?${IN_2031}`);
    expect(ids(res)).toEqual([d.id, r.instResolved.id, r.instCheck.id]);
    expect(res.body.total).toBe(3);
    await as.framer.put(`/api/condition/${d.id}`).send({ ...createBody(DATA, { reportDate: "2030-06-01" }), version: d.version });
  });

  it("when a collector opens the register, then only their own objects' signed reports are there", async () => {
    const res = await as.collector.get(`/api/condition?${IN_2031}`);
    expect(res.status).toBe(200);
    expect(ids(res)).toEqual([r.ownArrival.id]);
    // The examiners of the collector's signed reports only: never whoever examined other clients' objects.
    expect(res.body.examiners).toContainEqual({ id: examiner.id, name: "Register Examiner" });
    expect(res.body.examiners.map((e: { name: string }) => e.name)).not.toContain("Test registrar");
  });

  it("when a collector of another client or a client-side user without a client opens it, then it is empty", async () => {
    const stranger = await agentFor(t, await makePerson(t, "collector", makeClient(t.db, { kind: "private", name: "Newly arrived owner" }).id));
    const res = await stranger.get(`/api/condition?${IN_2031}`);
    expect(res.body).toEqual({ items: [], total: 0, page: 1, pageSize: 50, examiners: [] });
    const orphan = await agentFor(t, await makePerson(t, "registrar", null));
    expect((await orphan.get(`/api/condition?${IN_2031}`)).body.total).toBe(0);
  });

  it("when the register is filtered by rating, context or dates, then only matching reports come back", async () => {
    expect(ids(await as.framer.get(`/api/condition?${IN_2031}&rating=poor`))).toEqual([r.instCheck.id]);
    expect(ids(await as.framer.get(`/api/condition?${IN_2031}&context=periodic-check`))).toEqual([r.instCheck.id, r.ownDraft.id]);
    expect(ids(await as.framer.get("/api/condition?from=2031-02-01&to=2031-04-01"))).toEqual([r.instResolved.id, r.instCheck.id, r.ownDraft.id]);
  });

  it("when the register is filtered by examiner, then only their reports come back, and the examiners are listed for the filter", async () => {
    const res = await as.admin.get(`/api/condition?${IN_2031}&examinerId=${examiner.id}`);
    expect(ids(res)).toEqual([r.instResolved.id, r.ownArrival.id]);
    expect(res.body.examiners).toContainEqual({ id: examiner.id, name: "Register Examiner" });
    expect(res.body.examiners).toContainEqual({ id: studio.people.framer.id, name: "Test framer" });
  });

  it("when the register is filtered on unresolved findings, then true keeps reports with any and false those with none", async () => {
    expect(ids(await as.framer.get(`/api/condition?${IN_2031}&unresolved=false`))).toEqual([r.instResolved.id]);
    expect(ids(await as.framer.get(`/api/condition?${IN_2031}&unresolved=true`))).toEqual([r.otherIncident.id, r.instCheck.id, r.ownDraft.id, r.ownArrival.id]);
  });

  it("when the register is filtered by due date, then only reports of objects whose check falls due by then come back", async () => {
    expect(ids(await as.framer.get(`/api/condition?${IN_2031}&dueBy=2031-06-30`))).toEqual([r.ownDraft.id, r.ownArrival.id]);
    expect(ids(await as.framer.get(`/api/condition?${IN_2031}&dueBy=2031-12-31`))).toEqual([r.otherIncident.id, r.ownDraft.id, r.ownArrival.id]);
    expect(ids(await as.registrar.get(`/api/condition?${IN_2031}&dueBy=2031-12-31`))).toEqual([]);
  });

  it("when the register is paged, then each page holds its share and the total counts them all", async () => {
    const p2 = await as.framer.get(`/api/condition?${IN_2031}&pageSize=2&page=2`);
    expect(ids(p2)).toEqual([r.instCheck.id, r.ownDraft.id]);
    expect(p2.body).toMatchObject({ total: 5, page: 2, pageSize: 2 });
  });

  it("when a filter is not one the register knows, then it answers 422 naming it", async () => {
    const res = await as.framer.get("/api/condition?rating=splendid&unresolved=maybe&dueBy=soon&pageSize=500");
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {}).sort()).toEqual(["dueBy", "pageSize", "rating", "unresolved"]);
  });

  it("when a signed-out caller asks for the register, then it answers 401", async () => {
    const res = await t.agent().get("/api/condition");
    expect(res.status).toBe(401);
    expectErrorShape(res.body, "unauthenticated");
  });
});

describe("who may do what with condition reports", () => {
  const snapshot = (objectId: string) =>
    JSON.stringify({ r: reportsOf(objectId).map((x) => [x.id, x.version, x.status, x.currentRevision]), e: eventsOf(objectId).length, o: objectDates(objectId) });
  const READ = { admin: 200, framer: 200, "registrar-own": 200, "registrar-other": 404, "collector-own": 200, "collector-other": 404, "signed-out": 401 };
  const STUDIO_DRAFT = { admin: 200, framer: 200, "registrar-own": 200, "registrar-other": 404, "collector-own": 404, "collector-other": 404, "signed-out": 401 };

  const signed = (objectId: string) => signedOn(objectId);
  const draft = (objectId: string) => draftOn(objectId);
  const compared = async (objectId: string) => ({ a: await signedOn(objectId), b: await signedOn(objectId, DATA, { reportDate: "2026-11-19", context: "periodic-check" }) });
  const STUDIO_WRITE = { admin: 201, framer: 201, "registrar-own": 201, "registrar-other": 404, "collector-own": 403, "collector-other": 404, "signed-out": 401 };

  const ROWS: MatrixRow[] = [
    readRow("GET /api/objects/:id/condition", READ, signed, (agent, _r, o) => agent.get(`/api/objects/${o}/condition`)),
    {
      route: "POST /api/objects/:id/condition",
      expected: STUDIO_WRITE,
      run: async (agent, objectId) => {
        const res = await agent.post(`/api/objects/${objectId}/condition`).send(createBody());
        return { status: res.status, body: res.body, written: () => reportsOf(objectId).length > 0 };
      },
    },
    readRow("GET /api/condition/:id (signed)", READ, signed, (agent, r) => agent.get(`/api/condition/${r.id}`)),
    readRow("GET /api/condition/:id/revisions (signed)", READ, signed, (agent, r) => agent.get(`/api/condition/${r.id}/revisions`)),
    readRow("GET /api/condition/:id (draft)", STUDIO_DRAFT, draft, (agent, r) => agent.get(`/api/condition/${r.id}`)),
    readRow("GET /api/condition/:id/revisions (draft)", STUDIO_DRAFT, draft, (agent, r) => agent.get(`/api/condition/${r.id}/revisions`)),
    readRow("GET /api/condition/compare", READ, compared, (agent, { a, b }) => agent.get(`/api/condition/compare?from=${a.id}&to=${b.id}`)),
    // A collector cannot see a draft, so cannot learn that one exists by trying to write to it.
    writeRow("PUT /api/condition/:id (draft)", STUDIO_DRAFT, snapshot, draft, (agent, d) =>
      agent.put(`/api/condition/${d.id}`).send({ ...createBody(with_({ summary: "Edited." })), version: d.version }),
    ),
    writeRow(
      "PUT /api/condition/:id (signed)",
      { admin: 409, framer: 409, "registrar-own": 409, "registrar-other": 404, "collector-own": 403, "collector-other": 404, "signed-out": 401 },
      snapshot,
      signed,
      (agent, r) => agent.put(`/api/condition/${r.id}`).send({ ...createBody(with_({ summary: "Edited." })), version: r.version }),
    ),
    writeRow("POST /api/condition/:id/sign", STUDIO_DRAFT, snapshot, draft, (agent, d) => agent.post(`/api/condition/${d.id}/sign`).send({ version: d.version })),
    writeRow("POST /api/condition/:id/corrections", STUDIO_WRITE, snapshot, signed, (agent, r) =>
      agent.post(`/api/condition/${r.id}/corrections`).send({ version: r.version, correctionReason: "Extent measured again.", data: with_({ summary: "Corrected." }) }),
    ),
    {
      // Everyone signed in may open the register; what is in it depends on who asks.
      route: "GET /api/condition (the report is listed)",
      expected: { admin: 200, framer: 200, "registrar-own": 200, "registrar-other": 204, "collector-own": 200, "collector-other": 204, "signed-out": 401 },
      run: async (agent, objectId) => {
        const s = await signedOn(objectId, DATA, { reportDate: "2035-07-07" });
        const res = await agent.get("/api/condition?from=2035-07-07&to=2035-07-07&pageSize=200");
        const listed = res.status === 200 && (res.body.items as { id: string }[]).some((i) => i.id === s.id);
        // 204 stands for "answered 200 without the report in it".
        return { status: res.status === 200 && !listed ? 204 : res.status, body: res.body, written: () => false };
      },
    },
  ];

  accessMatrix(t, ROWS, () => ({ studio, as, otherPrivateClientId: otherPrivate }));

  it("when a registrar writes a report, then the report names the registrar as examiner", async () => {
    const r = await draftOn(makeObject(t.db, studio.institution.id), DATA, {}, as.registrar);
    expect(r.examinerName).toBe("Test registrar");
    expect(reportRow(r.id).examinerId).toBe(studio.people.registrar.id);
  });

  it("when the collector opens a draft's id, then the answer is the same as for an id that does not exist", async () => {
    const d = await draftOn(makeObject(t.db, studio.collectorClient.id));
    const a = await as.collector.get(`/api/condition/${d.id}`);
    const b = await as.collector.get("/api/condition/no-such-report");
    expect(a.status).toBe(404);
    expect(expectErrorShape(a.body, "not_found").message).toBe(expectErrorShape(b.body, "not_found").message);
  });
});

describe("the demo condition reports", () => {
  const demo = createTestApp();
  let framer: SessionUser;
  const numbered = (n: string) => findObjectIdByNumber(demo.db, n)!;
  const service = () => createConditionService(demo.db);

  beforeAll(async () => {
    await seedDemo(demo.db);
    const u = demo.db.select().from(user).where(eq(user.email, "framer@reversa.test")).get()!;
    framer = { id: u.id, name: u.name, email: u.email, role: "framer", clientId: null };
    // The lead calls seedCondition from seedDemo; calling it again must write nothing.
    seedCondition(demo.db, framer);
  });

  it("when the demo is seeded, then four signed reports exist and a second run writes none", () => {
    const rows = demo.db.select().from(conditionReports).all();
    expect(rows).toHaveLength(4);
    expect(rows.every((r) => r.status === "signed")).toBe(true);
    expect(seedCondition(demo.db, framer)).toBe(0);
  });

  it("when 2026-0001's two reports are compared, then the foxing is unchanged, the tear worsened and the abrasion new", () => {
    const reports = service().listForObject(framer, numbered("2026-0001"));
    expect(reports).toHaveLength(2);
    const [later, earlier] = [at(reports, 0), at(reports, 1)];
    const c = service().compare(framer, earlier.id, later.id);
    expect(Object.fromEntries(c.findings.map((f) => [(f.after ?? f.before)!.term, f.status]))).toEqual({ foxing: "unchanged", tear: "worsened", abrasion: "new" });
  });

  it("when 2026-0009's report is opened, then it shows the mould caution", () => {
    const r = first(service().listForObject(framer, numbered("2026-0009")));
    expect(r.cautions).toHaveLength(1);
    expect(r.cautions[0]).toMatch(/respirator/);
  });

  it("when 2026-0018 went out on loan, then its report is signed by both parties and its check falls due a loan interval later", () => {
    const id = numbered("2026-0018");
    const r = first(service().listForObject(framer, id));
    expect(r.context).toBe("loan-out");
    expect(r.current.data.signatures.otherParty?.name).toBe("Owen Taverner");
    const o = demo.db.select().from(objects).where(eq(objects.id, id)).get()!;
    expect(o.status).toBe("on-loan");
    expect(o.lastConditionOn).toBe("2026-08-26");
    // The studio's loan interval (12 months in the demo settings).
    expect(o.checkDueOn).toBe("2027-08-26");
  });

  it("when the demo's history is verified, then every chain holds", async () => {
    const admin = await signIn(demo.agent(), "admin@reversa.test", DEMO_PASSWORD);
    const res = await admin.get("/api/history/verify");
    expect(res.body.ok).toBe(true);
  });
});
