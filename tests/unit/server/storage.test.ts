import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { createHash } from "node:crypto";
import { afterAll, beforeEach, describe, expect, it } from "vitest";
import { createStorage, isStorageKey, storageKey } from "../../../server/lib/storage.ts";
import { filesUnder } from "../../setup/files.ts";

const base = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-storage-test-"));
afterAll(() => fs.rmSync(base, { recursive: true, force: true }));

let dir: string;
let n = 0;
beforeEach(() => {
  dir = path.join(base, `uploads-${++n}`);
});

const sha = (b: Buffer) => createHash("sha256").update(b).digest("hex");

describe("createStorage().put", () => {
  it("when bytes are put, then they are stored once under their SHA-256, sharded by its first two byte pairs", async () => {
    const s = createStorage(dir);
    const bytes = Buffer.from("a photograph, honestly");
    const h = sha(bytes);
    const stored = await s.put(bytes, "jpg");
    expect(stored).toEqual({ key: `${h.slice(0, 2)}/${h.slice(2, 4)}/${h}.jpg`, sha256: h, bytes: bytes.length, created: true });
    expect(fs.readFileSync(path.join(dir, stored.key))).toEqual(bytes);
    expect(filesUnder(dir)).toEqual([stored.key]);
  });

  it("when a file is put, then it is copied byte for byte (the source stays) and its hash is computed while copying", async () => {
    const s = createStorage(dir);
    const src = path.join(base, `src-${n}.bin`);
    const bytes = Buffer.alloc(3 * 1024 * 1024 + 17);
    for (let i = 0; i < bytes.length; i++) bytes[i] = (i * 31) & 0xff;
    fs.writeFileSync(src, bytes);
    const stored = await s.put({ file: src }, "tif");
    expect(stored.sha256).toBe(sha(bytes));
    expect(stored.bytes).toBe(bytes.length);
    expect(stored.key.endsWith(".tif")).toBe(true);
    expect(sha(fs.readFileSync(s.path(stored.key)))).toBe(sha(bytes));
    expect(fs.existsSync(src)).toBe(true);
  });

  it("when the same bytes are put twice, then the second put writes nothing and reports that it created nothing", async () => {
    const s = createStorage(dir);
    const bytes = Buffer.from("same bytes");
    const first = await s.put(bytes, "png");
    const mtime = fs.statSync(s.path(first.key)).mtimeMs;
    const again = await s.put(bytes, "png");
    const fromFile = await s.put({ file: s.path(first.key) }, "png");
    expect(again).toEqual({ ...first, created: false });
    expect(fromFile).toEqual({ ...first, created: false });
    expect(fs.statSync(s.path(first.key)).mtimeMs).toBe(mtime);
    expect(filesUnder(dir)).toEqual([first.key]);
  });

  it("when two puts of the same bytes race, then exactly one of them created the file", async () => {
    const s = createStorage(dir);
    const bytes = Buffer.from("raced");
    const results = await Promise.all([s.put(bytes, "jpg"), s.put(bytes, "jpg"), s.put(bytes, "jpg")]);
    expect(new Set(results.map((r) => r.key)).size).toBe(1);
    expect(results.filter((r) => r.created).length).toBe(1);
    expect(filesUnder(dir)).toEqual([results[0].key]);
  });

  it("when a put is done, then no temporary file is left in the uploads folder", async () => {
    const s = createStorage(dir);
    await s.put(Buffer.from("one"), "jpg");
    await s.put(Buffer.from("one"), "jpg");
    const src = path.join(base, `tmp-src-${n}`);
    fs.writeFileSync(src, "two");
    await s.put({ file: src }, "webp");
    expect(fs.readdirSync(path.join(dir, ".incoming"))).toEqual([]);
    expect(filesUnder(dir)).toHaveLength(2);
  });

  it("when the source file does not exist, then the put fails and nothing is stored", async () => {
    const s = createStorage(dir);
    await expect(s.put({ file: path.join(base, "no-such-file") }, "jpg")).rejects.toThrow();
    expect(filesUnder(dir)).toEqual([]);
  });

  it("when asked for an extension it does not know, then it refuses", async () => {
    const s = createStorage(dir);
    await expect(s.put(Buffer.from("x"), "svg" as "jpg")).rejects.toThrow(/extension/);
    expect(filesUnder(dir)).toEqual([]);
  });
});

describe("createStorage().path", () => {
  it("when given a key made by put, then it is the file's absolute path inside the uploads folder", async () => {
    const s = createStorage(dir);
    const { key } = await s.put(Buffer.from("inside"), "jpg");
    expect(s.path(key)).toBe(path.join(path.resolve(dir), key));
  });

  it.each([
    ["a parent folder", "../../etc/passwd"],
    ["an absolute path", "/etc/passwd"],
    ["a client's file name", "holiday.jpg"],
    ["upper-case hex", `AB/CD/ABCD${"0".repeat(60)}.jpg`],
    ["shards that do not match the hash", `ab/cd/ef01${"0".repeat(60)}.jpg`],
    ["an unknown extension", `ab/cd/abcd${"0".repeat(60)}.svg`],
    ["a short hash", "ab/cd/abcd.jpg"],
    ["a trailing segment", `ab/cd/abcd${"0".repeat(60)}.jpg/..`],
    ["backslashes", `ab\\cd\\abcd${"0".repeat(60)}.jpg`],
    ["a NUL byte", `ab/cd/abcd${"0".repeat(60)}.jpg\0`],
  ])("when given %s, then it refuses", (_what, key) => {
    const s = createStorage(dir);
    expect(() => s.path(key)).toThrow(/storage key/);
    expect(isStorageKey(key)).toBe(false);
  });

  it("when a key is built from a hash, then it has the sharded shape and passes the check", () => {
    const h = sha(Buffer.from("k"));
    expect(storageKey(h, "webp")).toBe(`${h.slice(0, 2)}/${h.slice(2, 4)}/${h}.webp`);
    expect(isStorageKey(storageKey(h, "webp"))).toBe(true);
    expect(() => storageKey("not-a-hash", "jpg")).toThrow();
  });
});

describe("createStorage().exists and remove", () => {
  it("when a stored file is removed, then it no longer exists and its empty shard folders go too", async () => {
    const s = createStorage(dir);
    const { key } = await s.put(Buffer.from("to remove"), "jpg");
    expect(await s.exists(key)).toBe(true);
    await s.remove(key);
    expect(await s.exists(key)).toBe(false);
    expect(fs.existsSync(path.join(dir, key.slice(0, 2)))).toBe(false);
    expect(fs.existsSync(dir)).toBe(true);
  });

  it("when one of two files in a shard is removed, then the other stays", async () => {
    const s = createStorage(dir);
    const a = await s.put(Buffer.from("first"), "jpg");
    const b = await s.put(Buffer.from("first"), "png");
    await s.remove(a.key);
    expect(await s.exists(b.key)).toBe(true);
    expect(filesUnder(dir)).toEqual([b.key]);
  });

  it("when a file that is not there is removed, then nothing happens; a malformed key is refused", async () => {
    const s = createStorage(dir);
    const h = sha(Buffer.from("never stored"));
    await expect(s.remove(storageKey(h, "jpg"))).resolves.toBeUndefined();
    expect(await s.exists(storageKey(h, "jpg"))).toBe(false);
    await expect(s.remove("../outside.jpg")).rejects.toThrow(/storage key/);
    await expect(s.exists("../outside.jpg")).rejects.toThrow(/storage key/);
  });
});
