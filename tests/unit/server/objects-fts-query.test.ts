import { afterAll, describe, expect, it } from "vitest";
import { toFtsQuery } from "../../../server/features/objects/objects.repo.ts";
import { openDatabase } from "../../../server/db/client.ts";

describe("toFtsQuery", () => {
  it("when one word is typed, then it becomes a quoted prefix term", () => {
    expect(toFtsQuery("harbour")).toBe('"harbour"*');
  });

  it("when several words are typed, then every word must match", () => {
    expect(toFtsQuery("harbour wall")).toBe('"harbour"* AND "wall"*');
  });

  it("when an object number is typed, then its parts become terms", () => {
    expect(toFtsQuery("2026-0014")).toBe('"2026"* AND "0014"*');
    expect(toFtsQuery("2026.14.3")).toBe('"2026"* AND "14"* AND "3"*');
  });

  it("when FTS5 operators or quotes are typed, then they are searched as words, not obeyed", () => {
    expect(toFtsQuery('pears OR "blue" NOT cloth*')).toBe('"pears"* AND "OR"* AND "blue"* AND "NOT"* AND "cloth"*');
    expect(toFtsQuery("title:heron")).toBe('"title"* AND "heron"*');
  });

  it("when only punctuation or nothing is typed, then there is no query", () => {
    expect(toFtsQuery("")).toBeNull();
    expect(toFtsQuery('  -- ** " ')).toBeNull();
  });

  it("when accented or full-width letters are typed, then they are kept as letters", () => {
    expect(toFtsQuery("Heikkilä")).toBe('"Heikkilä"*');
    // NFKC folds full-width digits to ASCII.
    expect(toFtsQuery("２０２６")).toBe('"2026"*');
  });

  it("when more than eight words are typed, then only the first eight are used", () => {
    const q = toFtsQuery("a b c d e f g h i j")!;
    expect(q.split(" AND ")).toHaveLength(8);
    expect(q).not.toContain('"i"');
  });

  describe("against the real FTS5 table", () => {
    // A migrated in-memory database: checks the output is valid FTS5 syntax, whatever was typed.
    const handle = openDatabase(":memory:");
    afterAll(() => handle.close());
    const match = (q: string) => handle.sqlite.prepare("select count(*) as n from objects_fts where objects_fts match ?").get(q);

    it("when hostile text is typed, then the query still runs", () => {
      for (const typed of ['"', "NEAR(a b)", "a AND", "OR", "*", "^start", "col:val", "(x", "a'b", "😀 tide"]) {
        const q = toFtsQuery(typed);
        if (q !== null) expect(() => match(q), typed).not.toThrow();
      }
    });
  });
});
