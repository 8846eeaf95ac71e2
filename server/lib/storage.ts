import fs from "node:fs";
import fsp from "node:fs/promises";
import path from "node:path";
import { createHash, randomUUID } from "node:crypto";

/**
 * The only code that writes under uploads/. Files are named by their content: the SHA-256 of their
 * bytes, sharded by its first two byte pairs (`ab/cd/abcd….jpg`), so a name never comes from a client
 * and the same bytes are stored once. Writes go to a temporary file inside the uploads folder and are
 * linked into place, so a reader never sees half a file.
 */
export const STORAGE_EXTS = ["jpg", "png", "webp", "tif"] as const;
export type StorageExt = (typeof STORAGE_EXTS)[number];

const KEY = /^([0-9a-f]{2})\/([0-9a-f]{2})\/([0-9a-f]{64})\.(jpg|png|webp|tif)$/;
const INCOMING = ".incoming";

export type StoredFile = {
  key: string;
  sha256: string;
  bytes: number;
  /** False when a file with these bytes was already stored (then nothing was written). */
  created: boolean;
};

export type Storage = ReturnType<typeof createStorage>;

/** True for a well-formed key whose shard folders match its hash. */
export function isStorageKey(key: unknown): key is string {
  if (typeof key !== "string") return false;
  const [, shard1, shard2, hash] = KEY.exec(key) ?? [];
  return hash?.startsWith(`${shard1}${shard2}`) === true;
}

export function storageKey(sha256: string, ext: StorageExt): string {
  const key = `${sha256.slice(0, 2)}/${sha256.slice(2, 4)}/${sha256}.${ext}`;
  if (!isStorageKey(key)) throw new Error("storage: not a SHA-256 hex digest or a known extension");
  return key;
}

const isErr = (e: unknown, ...codes: string[]) => codes.includes((e as NodeJS.ErrnoException)?.code ?? "");

export function createStorage(uploadsDir: string) {
  const root = path.resolve(uploadsDir);
  const incoming = path.join(root, INCOMING);

  function resolve(key: string): string {
    if (!isStorageKey(key)) throw new Error("storage: not a storage key");
    const p = path.join(root, key);
    // The pattern already rules out "..", separators and absolute paths; this is the second lock.
    if (path.dirname(path.dirname(path.dirname(p))) !== root) throw new Error("storage: key outside the uploads folder");
    return p;
  }

  async function exists(key: string): Promise<boolean> {
    try {
      return (await fsp.stat(resolve(key))).isFile();
    } catch (e) {
      if (isErr(e, "ENOENT", "ENOTDIR")) return false;
      throw e;
    }
  }

  /** Moves a finished temporary file to its name; an existing file of the same name is kept. */
  async function commit(tmp: string, key: string): Promise<boolean> {
    const final = resolve(key);
    await fsp.mkdir(path.dirname(final), { recursive: true });
    try {
      // link() refuses to replace, so exactly one of two concurrent writers of the same bytes "creates" it.
      await fsp.link(tmp, final);
      return true;
    } catch (e) {
      if (isErr(e, "EEXIST")) return false;
      if (!isErr(e, "EPERM", "ENOTSUP", "EOPNOTSUPP", "EXDEV")) throw e;
      // File systems without hard links: rename is atomic too (it may replace identical bytes).
      if (await exists(key)) return false;
      await fsp.rename(tmp, final);
      return true;
    } finally {
      await fsp.rm(tmp, { force: true });
    }
  }

  async function writeTemp(write: (fh: fsp.FileHandle) => Promise<void>): Promise<string> {
    await fsp.mkdir(incoming, { recursive: true });
    const tmp = path.join(incoming, randomUUID());
    const fh = await fsp.open(tmp, "wx", 0o640);
    try {
      await write(fh);
      await fh.sync();
    } catch (e) {
      await fh.close().catch(() => {});
      await fsp.rm(tmp, { force: true });
      throw e;
    }
    await fh.close();
    return tmp;
  }

  /** Removes now-empty shard folders after a file is removed (never the uploads folder itself). */
  async function prune(dir: string) {
    for (let d = dir; d !== root && d.startsWith(root + path.sep); d = path.dirname(d)) {
      try {
        await fsp.rmdir(d);
      } catch {
        return;
      }
    }
  }

  return {
    root,

    /**
     * Stores bytes (a buffer, or a file read once while being hashed and copied) under their SHA-256.
     * The source file is left where it is. Idempotent: the same bytes give the same key.
     */
    async put(source: Buffer | { file: string }, ext: StorageExt): Promise<StoredFile> {
      if (Buffer.isBuffer(source)) {
        const sha256 = createHash("sha256").update(source).digest("hex");
        const key = storageKey(sha256, ext);
        if (await exists(key)) return { key, sha256, bytes: source.length, created: false };
        const tmp = await writeTemp((fh) => fh.writeFile(source));
        return { key, sha256, bytes: source.length, created: await commit(tmp, key) };
      }
      const hash = createHash("sha256");
      let bytes = 0;
      const tmp = await writeTemp(async (fh) => {
        for await (const chunk of fs.createReadStream(source.file, { highWaterMark: 1 << 20 }) as AsyncIterable<Buffer>) {
          hash.update(chunk);
          bytes += chunk.length;
          await fh.write(chunk);
        }
      });
      const sha256 = hash.digest("hex");
      const key = storageKey(sha256, ext);
      return { key, sha256, bytes, created: await commit(tmp, key) };
    },

    /** The absolute path of a stored file. Only keys made by put() (read back from the database) are accepted. */
    path: resolve,

    exists,

    /** Removes a stored file; removing one that is not there is not an error. */
    async remove(key: string): Promise<void> {
      const p = resolve(key);
      await fsp.rm(p, { force: true });
      await prune(path.dirname(p));
    },
  };
}
