import fs from "node:fs";
import fsp from "node:fs/promises";
import path from "node:path";
import { createHash } from "node:crypto";
import Database from "better-sqlite3";

/** The files beside the database that a backup carries: the secrets and the history checkpoints. */
export const SIDE_FILES = [".auth-secret", ".history-key", "history-checkpoints.log"] as const;
export const MANIFEST = "manifest.json";

export type BackupManifest = {
  createdAt: string;
  files: { path: string; bytes: number; sha256: string }[];
};

async function sha256Of(file: string): Promise<{ bytes: number; sha256: string }> {
  const hash = createHash("sha256");
  let bytes = 0;
  for await (const chunk of fs.createReadStream(file) as AsyncIterable<Buffer>) {
    hash.update(chunk);
    bytes += chunk.length;
  }
  return { bytes, sha256: hash.digest("hex") };
}

function walk(dir: string, base = dir, out: string[] = []): string[] {
  if (!fs.existsSync(dir)) return out;
  for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, e.name);
    // Half-written files are not part of any record; quarantined ones are a person's to look at, not to restore.
    if (e.isDirectory() && (e.name === ".incoming" || e.name === ".quarantine")) continue;
    if (e.isDirectory()) walk(p, base, out);
    else if (e.isFile()) out.push(path.relative(base, p));
  }
  return out;
}

/** A line being appended while the file was copied is cut off at the copy's last complete line. */
async function dropPartialLine(file: string): Promise<void> {
  const text = await fsp.readFile(file, "utf8");
  const end = text.lastIndexOf("\n") + 1;
  if (end < text.length) await fsp.truncate(file, Buffer.byteLength(text.slice(0, end), "utf8"));
}

/**
 * A consistent copy while the app runs: the secrets and history checkpoints, then the database through
 * SQLite's online backup API (a snapshot of one moment, whatever is being written), then the uploads
 * (written before their rows, so every file the snapshot names is already there), and a manifest of every
 * file's SHA-256.
 * Copying the database file alone while the app runs can miss writes still in its WAL file.
 */
export async function backup(opts: {
  databaseUrl: string;
  uploadsDir: string;
  to: string;
  now?: Date;
  /** The history checkpoints when HISTORY_CHECKPOINTS keeps them away from the database (checkpointsFileFor). */
  checkpointsFile?: string | null;
}): Promise<BackupManifest> {
  const to = path.resolve(opts.to);
  if (fs.existsSync(to) && fs.readdirSync(to).length) throw new Error(`The backup folder ${to} is not empty: choose a new one.`);
  fs.mkdirSync(to, { recursive: true, mode: 0o700 });
  // The side files first: a checkpoint is appended after its write commits, so checkpoints copied before
  // the snapshot only name events the snapshot holds (copied after, they could name events it lacks).
  const dbDir = path.dirname(path.resolve(opts.databaseUrl));
  for (const f of SIDE_FILES) {
    // The checkpoints may live elsewhere (HISTORY_CHECKPOINTS); wherever they are, the backup carries them
    // under their usual name, and a restore puts them beside the database, where Reversa looks by default.
    const p = f === "history-checkpoints.log" && opts.checkpointsFile ? path.resolve(opts.checkpointsFile) : path.join(dbDir, f);
    if (!fs.existsSync(p)) continue;
    await fsp.mkdir(path.join(to, "side"), { recursive: true, mode: 0o700 });
    const dest = path.join(to, "side", f);
    await fsp.copyFile(p, dest);
    if (f === "history-checkpoints.log") await dropPartialLine(dest);
  }
  const source = new Database(opts.databaseUrl, { fileMustExist: true });
  try {
    source.pragma("busy_timeout = 5000");
    await source.backup(path.join(to, "reversa.db"));
  } finally {
    source.close();
  }
  const uploads = path.resolve(opts.uploadsDir);
  for (const rel of walk(uploads)) {
    const dest = path.join(to, "uploads", rel);
    await fsp.mkdir(path.dirname(dest), { recursive: true });
    await fsp.copyFile(path.join(uploads, rel), dest);
  }
  const files: BackupManifest["files"] = [];
  for (const rel of walk(to).sort()) files.push({ path: rel.split(path.sep).join("/"), ...(await sha256Of(path.join(to, rel))) });
  const manifest: BackupManifest = { createdAt: (opts.now ?? new Date()).toISOString(), files };
  await fsp.writeFile(path.join(to, MANIFEST), JSON.stringify(manifest, null, 2), { mode: 0o600 });
  return manifest;
}

/**
 * Brings a backup back into an empty folder: checks every file against the manifest first (nothing is
 * written when one is missing or altered), then lays out reversa.db, uploads/ and the side files.
 */
export async function restore(opts: { from: string; to: string }): Promise<{ databaseUrl: string; uploadsDir: string; files: number }> {
  const from = path.resolve(opts.from);
  const to = path.resolve(opts.to);
  const manifestFile = path.join(from, MANIFEST);
  if (!fs.existsSync(manifestFile)) throw new Error(`${from} has no ${MANIFEST}: it is not a Reversa backup.`);
  if (fs.existsSync(to) && fs.readdirSync(to).length) throw new Error(`${to} is not empty: restore into a new, empty folder.`);
  const manifest = JSON.parse(fs.readFileSync(manifestFile, "utf8")) as BackupManifest;
  for (const f of manifest.files) {
    const p = path.join(from, ...f.path.split("/"));
    if (!fs.existsSync(p)) throw new Error(`The backup is incomplete: ${f.path} is missing. Nothing was restored.`);
    const got = await sha256Of(p);
    if (got.sha256 !== f.sha256) throw new Error(`The backup is damaged: ${f.path} does not match its SHA-256. Nothing was restored.`);
  }
  fs.mkdirSync(to, { recursive: true, mode: 0o700 });
  for (const f of manifest.files) {
    const rel = f.path.startsWith("side/") ? f.path.slice(5) : f.path;
    const dest = path.join(to, ...rel.split("/"));
    await fsp.mkdir(path.dirname(dest), { recursive: true });
    await fsp.copyFile(path.join(from, ...f.path.split("/")), dest);
    if (f.path.startsWith("side/")) await fsp.chmod(dest, 0o600);
  }
  return { databaseUrl: path.join(to, "reversa.db"), uploadsDir: path.join(to, "uploads"), files: manifest.files.length };
}
