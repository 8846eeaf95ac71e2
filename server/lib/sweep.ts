import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { sql } from "drizzle-orm";
import type { Db } from "../db/client.ts";
import { isStorageKey } from "./storage.ts";

export type SweepReport = { incomingRemoved: number; uploadTempRemoved: number; quarantined: string[]; quarantineDir: string | null };

/** Every storage key a row names: the four versions of each photo and the studio's logo. */
function keysInUse(db: Db): Set<string> {
  const rows = db.all<{ k: string | null }>(sql`
    select original_key as k from photos union select full_key from photos union select web_key from photos
    union select thumb_key from photos union select logo_key from studio_settings`);
  return new Set(rows.map((r) => r.k).filter((k): k is string => !!k));
}

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === "EPERM";
  }
};

/**
 * Tidies what a crash can leave behind, before the server takes requests:
 * - half-written files in uploads/.incoming (a write is only linked into place once complete);
 * - upload folders in the system's temporary space of processes that are no longer running;
 * - stored files that no row names (a crash between writing a photo's files and its row): moved, not
 *   deleted, to uploads/.quarantine/<time>/ with their key as the path, and reported, so nothing a person
 *   might still want is lost.
 */
export function sweepAfterCrash(db: Db, uploadsDir: string, now: Date = new Date()): SweepReport {
  const root = path.resolve(uploadsDir);
  const report: SweepReport = { incomingRemoved: 0, uploadTempRemoved: 0, quarantined: [], quarantineDir: null };

  const incoming = path.join(root, ".incoming");
  if (fs.existsSync(incoming)) {
    for (const name of fs.readdirSync(incoming)) {
      fs.rmSync(path.join(incoming, name), { recursive: true, force: true });
      report.incomingRemoved++;
    }
  }

  for (const name of fs.readdirSync(os.tmpdir())) {
    const m = /^reversa-upload-(\d+)-/.exec(name);
    if (!m || Number(m[1]) === process.pid || alive(Number(m[1]))) continue;
    fs.rmSync(path.join(os.tmpdir(), name), { recursive: true, force: true });
    report.uploadTempRemoved++;
  }

  if (!fs.existsSync(root)) return report;
  const used = keysInUse(db);
  const stamp = now.toISOString().replace(/[:.]/g, "-");
  for (const a of fs.readdirSync(root)) {
    if (!/^[0-9a-f]{2}$/.test(a)) continue;
    for (const b of fs.readdirSync(path.join(root, a))) {
      if (!/^[0-9a-f]{2}$/.test(b)) continue;
      for (const file of fs.readdirSync(path.join(root, a, b))) {
        const key = `${a}/${b}/${file}`;
        if (isStorageKey(key) && used.has(key)) continue;
        report.quarantineDir ??= path.join(root, ".quarantine", stamp);
        const to = path.join(report.quarantineDir, a, b, file);
        fs.mkdirSync(path.dirname(to), { recursive: true });
        fs.renameSync(path.join(root, key), to);
        report.quarantined.push(key);
      }
    }
  }
  return report;
}
