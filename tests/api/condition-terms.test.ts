import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { agentsFor, createTestApp, expectErrorShape, makeConditionReport, makeObject, makeStudio, type Agent } from "../setup/test-app.ts";
import { conditionTerms } from "../../server/db/schema.ts";
import type { ConditionReport, Term } from "../../shared/schemas/condition.ts";
import { first } from "../setup/lists.ts";

const t = createTestApp();

type Role = "admin" | "framer" | "registrar" | "collector";
let studio: Awaited<ReturnType<typeof makeStudio>>;
let as: Record<Role, Agent>;
const ROLES: Role[] = ["admin", "framer", "registrar", "collector"];

const termRows = () => t.db.select().from(conditionTerms).all();
const words = (items: Term[]) => items.map((i) => i.term);

beforeAll(async () => {
  studio = await makeStudio(t);
  as = await agentsFor(t, studio.people);
});

describe("reading the vocabulary", () => {
  // docs/trade.md §14: paper terms from the Smithsonian MCI and conservators' glossaries; photograph terms from NEDCC Preservation 101.
  it.each(ROLES)("when %s reads the paper list, then the 22 terms come back in their order", async (role) => {
    const res = await as[role].get("/api/condition-terms?list=paper");
    expect(res.status).toBe(200);
    expect(res.body.items).toHaveLength(22);
    expect(words(res.body.items).slice(0, 3)).toEqual(["abrasion", "accretion", "acid (mat) burn"]);
    expect(words(res.body.items).at(-1)).toBe("trimmed margin");
    const orders = res.body.items.map((i: Term) => i.sortOrder);
    expect(orders).toEqual([...orders].sort((a: number, b: number) => a - b));
  });

  it("when the photograph list is read, then its own seven terms come back", async () => {
    const res = await as.collector.get("/api/condition-terms?list=photograph");
    expect(words(res.body.items)).toEqual(["emulsion abrasion", "cracking", "lifting", "silver mirroring", "yellowing", "ferrotyping", "tarnish"]);
  });

  it("when no list is named, then both come back, paper first", async () => {
    const res = await as.framer.get("/api/condition-terms");
    expect(res.body.items).toHaveLength(29);
    expect(res.body.items[0].list).toBe("paper");
    expect(res.body.items.at(-1).list).toBe("photograph");
  });

  it("when a term is read, then it has its id, list, words, caution, active flag and place", async () => {
    const res = await as.registrar.get("/api/condition-terms?list=paper");
    const mould = res.body.items.find((i: Term) => i.term === "mould");
    expect(mould).toEqual({ id: "paper-16", list: "paper", term: "mould", caution: expect.stringContaining("respirator"), active: true, sortOrder: 16 });
    expect(res.body.items.find((i: Term) => i.term === "insect damage").caution).toMatch(/isolate and seal/i);
    expect(res.body.items.find((i: Term) => i.term === "foxing").caution).toBeNull();
  });

  it("when someone other than the admin asks for retired terms too, then it answers 403", async () => {
    for (const role of ["framer", "registrar", "collector"] as const) {
      const res = await as[role].get("/api/condition-terms?all=true");
      expect(res.status, role).toBe(403);
      expectErrorShape(res.body, "forbidden");
    }
    expect((await as.framer.get("/api/condition-terms?all=false")).status).toBe(200);
  });

  it("when the list or flag is not one it knows, then it answers 422 naming it", async () => {
    const res = await as.admin.get("/api/condition-terms?list=canvas&all=yes");
    expect(res.status).toBe(422);
    expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {}).sort()).toEqual(["all", "list"]);
  });

  it("when a signed-out caller reads the vocabulary, then it answers 401", async () => {
    const res = await t.agent().get("/api/condition-terms");
    expect(res.status).toBe(401);
    expectErrorShape(res.body, "unauthenticated");
  });
});

describe("keeping the vocabulary", () => {
  it("when the admin adds a term, then it answers 201 and it goes last in its list", async () => {
    const res = await as.admin
      .post("/api/condition-terms")
      .send({ list: "paper", term: "  media flaking  ", caution: "Friable media: do not brush; keep the sheet flat and face up." });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ list: "paper", term: "media flaking", active: true, sortOrder: 23 });
    expect(res.body.caution).toMatch(/Friable/);
    const list = await as.framer.get("/api/condition-terms?list=paper");
    expect(words(list.body.items).at(-1)).toBe("media flaking");
  });

  it("when a term already in the list is added again, in any case, then it answers 409 at term and nothing is added", async () => {
    const before = termRows().length;
    for (const term of ["foxing", "Foxing", "MEDIA FLAKING"]) {
      const res = await as.admin.post("/api/condition-terms").send({ list: "paper", term });
      expect(res.status, term).toBe(409);
      expect(Object.keys(expectErrorShape(res.body, "conflict").fields ?? {})).toEqual(["term"]);
    }
    expect(termRows()).toHaveLength(before);
  });

  it("when the same words are added to the other list, then that is allowed", async () => {
    const res = await as.admin.post("/api/condition-terms").send({ list: "photograph", term: "foxing" });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ list: "photograph", term: "foxing", caution: null, sortOrder: 8 });
  });

  it("when a term is blank, too long, or of no list, then it answers 422 naming the field", async () => {
    const cases: [object, string[]][] = [
      [{ list: "paper", term: "   " }, ["term"]],
      [{ list: "canvas", term: "craquelure" }, ["list"]],
      [{ list: "paper", term: "x".repeat(121) }, ["term"]],
      [{ list: "paper", term: "smoke damage", caution: "c".repeat(1001) }, ["caution"]],
      [{ list: "paper", term: "smoke damage", active: "yes" }, ["active"]],
    ];
    for (const [body, fields] of cases) {
      const res = await as.admin.post("/api/condition-terms").send(body);
      expect(res.status, JSON.stringify(body).slice(0, 60)).toBe(422);
      expect(Object.keys(expectErrorShape(res.body, "validation_failed").fields ?? {})).toEqual(fields);
    }
  });

  it("when the admin edits a term, then its words, caution and place change", async () => {
    const made = (await as.admin.post("/api/condition-terms").send({ list: "paper", term: "smoke damge" })).body as Term;
    const res = await as.admin
      .put(`/api/condition-terms/${made.id}`)
      .send({ list: "paper", term: "smoke damage", caution: "Soot smears: do not touch the surface.", active: true, sortOrder: 2 });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ id: made.id, list: "paper", term: "smoke damage", caution: "Soot smears: do not touch the surface.", active: true, sortOrder: 2 });
  });

  it("when an edit would make a term the same as another in its list, then it answers 409; keeping its own words is fine", async () => {
    const tear = (await as.admin.get("/api/condition-terms?list=paper")).body.items.find((i: Term) => i.term === "tear") as Term;
    const clash = await as.admin.put(`/api/condition-terms/${tear.id}`).send({ ...tear, term: "Crease" });
    expect(clash.status).toBe(409);
    expectErrorShape(clash.body, "conflict");
    const same = await as.admin.put(`/api/condition-terms/${tear.id}`).send({ ...tear, caution: null });
    expect(same.status).toBe(200);
    expect(t.db.select().from(conditionTerms).where(eq(conditionTerms.id, tear.id)).get()!.term).toBe("tear");
  });

  it("when an unknown term is edited, then it answers 404", async () => {
    const res = await as.admin.put("/api/condition-terms/no-such-term").send({ list: "paper", term: "whatever" });
    expect(res.status).toBe(404);
    expectErrorShape(res.body, "not_found");
  });

  it("when the admin retires a term, then it leaves the active list but stays in the full one", async () => {
    const made = (await as.admin.post("/api/condition-terms").send({ list: "paper", term: "bloom" })).body as Term;
    const res = await as.admin.put(`/api/condition-terms/${made.id}`).send({ ...made, active: false });
    expect(res.status).toBe(200);
    expect(res.body.active).toBe(false);
    expect(words((await as.framer.get("/api/condition-terms?list=paper")).body.items)).not.toContain("bloom");
    const all = await as.admin.get("/api/condition-terms?list=paper&all=true");
    expect(all.body.items.find((i: Term) => i.id === made.id)).toMatchObject({ term: "bloom", active: false });
  });

  it.each(["framer", "registrar", "collector"] as const)("when %s tries to add or edit a term, then it answers 403 and nothing changes", async (role) => {
    const before = JSON.stringify(termRows());
    const post = await as[role].post("/api/condition-terms").send({ list: "paper", term: `added by ${role}` });
    expect(post.status).toBe(403);
    expectErrorShape(post.body, "forbidden");
    const put = await as[role].put("/api/condition-terms/paper-12").send({ list: "paper", term: "foxed", active: false });
    expect(put.status).toBe(403);
    expectErrorShape(put.body, "forbidden");
    expect(JSON.stringify(termRows())).toBe(before);
  });

  it("when a signed-out caller tries to add or edit a term, then it answers 401", async () => {
    expect((await t.agent().post("/api/condition-terms").send({ list: "paper", term: "x" })).status).toBe(401);
    expect((await t.agent().put("/api/condition-terms/paper-12").send({ list: "paper", term: "x" })).status).toBe(401);
  });

  it("when anyone sends DELETE for a term, then there is no such route and the term stays", async () => {
    const res = await as.admin.delete("/api/condition-terms/paper-12");
    expect(res.status).toBe(404);
    expect(t.db.select().from(conditionTerms).where(eq(conditionTerms.id, "paper-12")).get()).toBeDefined();
  });
});

describe("old reports keep their words", () => {
  it("when a term used in a signed report is renamed and retired, then the report still reads as written, with its caution", async () => {
    const made = (await as.admin.post("/api/condition-terms").send({ list: "paper", term: "active mould bloom", caution: "Treat as mould: nitrile gloves and a respirator." }))
      .body as Term;
    const objectId = makeObject(t.db, studio.collectorClient.id);
    const finding = { id: "f-1", term: "active mould bloom", location: { kind: "zone", zone: "verso" }, severity: "moderate" } as const;
    // Signed on arrival, 2026-03-02, by the framer (the factory signs through the condition service).
    const report = makeConditionReport(t.db, studio.people.framer, objectId, {
      reportDate: "2026-03-02",
      data: { overallRating: "fair", summary: "Bloom on the back.", findings: [finding] },
    });
    expect(report.status).toBe("signed");
    expect((await as.admin.put(`/api/condition-terms/${made.id}`).send({ ...made, active: false })).status).toBe(200);
    const r: ConditionReport = (await as.collector.get(`/api/condition/${report.id}`)).body;
    expect(first(r.current.data.findings).term).toBe("active mould bloom");
    expect(r.cautions).toEqual(["Treat as mould: nitrile gloves and a respirator."]);
    // Renaming the retired term changes the list, never the words of the report.
    await as.admin.put(`/api/condition-terms/${made.id}`).send({ ...made, term: "mould bloom", active: false });
    expect((await as.collector.get(`/api/condition/${report.id}`)).body.current.data.findings[0].term).toBe("active mould bloom");
  });
});
