import fs from "node:fs";
import { inTransaction } from "../../db/client.ts";
import fsp from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { createHash, randomUUID } from "node:crypto";
import { ZipArchive } from "archiver";
import type { Db } from "../../db/client.ts";
import { DATASETS, type Dataset, type JobStatus } from "../../../shared/schemas/exports.ts";
import type { Config } from "../../lib/config.ts";
import { can, isStudio } from "../../../shared/permissions.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import type { ClientRecord } from "../../../shared/schemas/clients.ts";
import { CUSTODY_KIND_LABELS } from "../../../shared/schemas/custody.ts";
import { PHOTO_KIND_LABELS } from "../../../shared/schemas/photos.ts";
import { conflict, forbidden, notFound } from "../../lib/errors.ts";
import { createStorage } from "../../lib/storage.ts";
import { appendEvent } from "../history/history.chain.ts";
import { gatherInWorker } from "./export-pool.ts";
import { issueDossier } from "../documents/dossier.tsx";
import { issueConditionReport } from "../documents/condition-pdf.tsx";
import { issueCustodyReceipt } from "../documents/custody-receipt.tsx";
import { label } from "./exports.columns.ts";
import { toCsv } from "./exports.datasets.ts";
import { createExportsRepo } from "./exports.repo.ts";

export { DATASETS, FORMATS, type Dataset, type ExportFilters, type Format } from "../../../shared/schemas/exports.ts";

// The bulk ZIP of one client's records, as a background job kept in export_jobs. The datasets are in
// exports.datasets.ts (their columns in exports.columns.ts); both are re-exported here for callers.

export type { JobState, JobStatus } from "../../../shared/schemas/exports.ts";

type Job = JobStatus & {
  id: string;
  ownerId: string;
  clientId: string;
  createdAt: number;
  dir: string;
  file: string;
  filename: string;
  timer: NodeJS.Timeout;
  /** Whether studio staff asked for the photos' original files (with their metadata) instead of the stripped copies. */
  originals: boolean;
  /** Why a failed job failed, for the server's eyes only. */
  error?: unknown;
};

export const JOB_TTL_MS = 60 * 60 * 1000;
const EVENTS_PER_TRANSACTION = 200;

// Control characters (U+0000–U+001F) are not allowed in ZIP entry names on most systems.
// biome-ignore lint/suspicious/noControlCharactersInRegex: matching control characters is the point
const safeSegment = (s: string) => s.replace(/[\\/:*?"<>|\u0000-\u001f]/g, "_").replace(/^\.+/, "_") || "_";
const slug = (s: string, fallback = "client") =>
  s
    .normalize("NFKD")
    .replace(/[^\w\s-]/g, "")
    .trim()
    .replace(/\s+/g, "-")
    .toLowerCase()
    .slice(0, 60) || fallback;

/** One line of the archive's manifest. */
export type ManifestEntry = { file: string; kind: string; objectNumber: string | null; caption: string | null; bytes: number; sha256: string };
export const MANIFEST_COLUMNS = ["File", "Kind", "Object number", "Caption", "Bytes", "SHA-256"] as const;
const DATASET_CAPTIONS: Record<Dataset, string> = {
  objects: "Catalogue data of every object",
  mountings: "Every mounting record, with its plan figures in mm and its checks",
  condition: "Every condition report, with its findings and recommendations",
  custody: "Every hand-over into and out of the studio",
  valuations: "The current valuation of each valued object",
};

export function createExportsService(db: Db, config: Pick<Config, "uploadsDir">, clock: () => Date) {
  const storage = createStorage(config.uploadsDir);
  /** The jobs this process is building now; every job's state is also in export_jobs, so a restart finds it. */
  const building = new Map<string, Job>();

  const repo = createExportsRepo(db);
  const save = (job: Pick<Job, "id" | "state" | "progress" | "message">) => repo.jobs.save(job);

  async function expire(row: { id: string; dir: string }) {
    const timer = building.get(row.id)?.timer;
    if (timer) clearTimeout(timer);
    building.delete(row.id);
    repo.jobs.remove(row.id);
    await fsp.rm(row.dir, { recursive: true, force: true });
  }

  // At start: a job that was running when the process stopped cannot be resumed from half a ZIP; it is
  // marked failed (its owner sees why and starts again) and its partial file removed. Expired jobs go.
  for (const row of repo.jobs.all()) {
    if (clock().getTime() - row.createdAtMs > JOB_TTL_MS) {
      void expire(row);
    } else if (row.state === "running") {
      save({ id: row.id, state: "failed", progress: row.progress, message: "Reversa restarted while this archive was being built, so it was not finished. Start it again." });
      fs.rmSync(row.dir, { recursive: true, force: true });
    }
  }

  /** A job the user may see: only its owner, and only within the hour; anyone else gets 404 as for no job. */
  function ownJob(user: SessionUser, jobId: string) {
    const row = repo.jobs.byId(jobId);
    if (!row || row.ownerId !== user.id) throw notFound("That export");
    if (clock().getTime() - row.createdAtMs > JOB_TTL_MS) {
      void expire(row);
      throw notFound("That export");
    }
    return row;
  }

  async function run(job: Job, user: SessionUser, client: ClientRecord) {
    const withValuation = can(user, "valuation:read", { clientId: client.id });
    const datasets = DATASETS.filter((d) => d !== "valuations" || withValuation);
    // The datasets are gathered and written out in a worker thread (export.worker.ts), in one read transaction.
    const gathered = await gatherInWorker(db, { user, clientId: client.id, datasets, formats: ["csv", "json"], filters: {} });
    const objs = gathered.objects;
    const byId = new Map(objs.map((o) => [o.id, o]));
    const ids = [...byId.keys()];
    // Photos of draft reports only to those who may see drafts (as the photos service); originals, which may
    // carry GPS, camera and owner metadata, only to studio staff who asked for them; everyone else gets the
    // full-size copy with its metadata stripped.
    const withDrafts = can(user, "condition:read", { clientId: client.id, draft: true });
    const draftReports = repo.draftReportIds(ids);
    const originals = job.originals && isStudio(user);
    const photoRows = repo.photosOf(ids).filter((p) => withDrafts || !p.reportId || !draftReports.has(p.reportId));
    // Signed reports only: a draft can still change, and a document is issued only for a signed report.
    const reportRows = repo.signedReportsOf(ids);
    const receiptRows = repo.receiptsOf(ids);

    // Photos named so a person can tell them apart: object number, its order on the object, kind and caption.
    const files: { file: string; name: string; objectId: string; caption: string | null }[] = [];
    const perObject = new Map<string, number>();
    let missing = 0;
    for (const p of photoRows) {
      const n = (perObject.get(p.objectId) ?? 0) + 1;
      perObject.set(p.objectId, n);
      const key = originals ? p.originalKey : p.fullKey;
      let file: string;
      try {
        file = storage.path(key);
      } catch {
        missing++;
        continue;
      }
      if (!fs.existsSync(file)) {
        missing++;
        continue;
      }
      const number = safeSegment(byId.get(p.objectId)!.objectNumber);
      const ext = path.extname(key).slice(1) || "bin";
      const words = [label(PHOTO_KIND_LABELS, p.kind), p.caption]
        .filter(Boolean)
        .map((w) => slug(w!, ""))
        .filter(Boolean)
        .join("-")
        .slice(0, 60);
      files.push({ file, name: `photos/${number}/${number}-${String(n).padStart(2, "0")}${words ? `-${words}` : ""}.${ext}`, objectId: p.objectId, caption: p.caption });
    }

    let total = gathered.files.length + files.length + objs.length + reportRows.length + receiptRows.length + 2;
    let added = 0;
    const out = fs.createWriteStream(job.file, { mode: 0o600 });
    const archive = new ZipArchive({ zlib: { level: 6 } });
    const closed = new Promise<void>((resolve, reject) => {
      out.on("close", resolve);
      out.on("error", reject);
      archive.on("error", reject);
      archive.on("warning", reject);
    });
    archive.on("entry", () => {
      added++;
      // Held just under 1 until the file is closed, so "1" always means the ZIP can be downloaded.
      job.progress = Math.min(0.99, added / total);
      job.message = `Added ${added} of ${total} files.`;
      save(job);
    });
    archive.pipe(out);

    // Every file with its SHA-256, for the manifest: a reader can check each file against it.
    const manifest: ManifestEntry[] = [];
    const put = (data: Buffer | string, entry: Omit<ManifestEntry, "sha256" | "bytes">) => {
      const buf = typeof data === "string" ? Buffer.from(data, "utf8") : data;
      archive.append(buf, { name: entry.file });
      manifest.push({ ...entry, bytes: buf.length, sha256: createHash("sha256").update(buf).digest("hex") });
    };
    for (const f of gathered.files) {
      put(f.text, { file: `${f.dataset}.${f.format}`, kind: f.format === "csv" ? "dataset (CSV)" : "dataset (JSON)", objectNumber: null, caption: DATASET_CAPTIONS[f.dataset] });
    }
    for (const f of files) {
      const hash = createHash("sha256");
      let bytes = 0;
      for await (const chunk of fs.createReadStream(f.file)) {
        hash.update(chunk as Buffer);
        bytes += (chunk as Buffer).length;
      }
      archive.file(f.file, { name: f.name });
      manifest.push({
        file: f.name,
        kind: originals ? "photo (original file, with its metadata)" : "photo (full size, metadata removed)",
        objectNumber: byId.get(f.objectId)!.objectNumber,
        caption: f.caption,
        bytes,
        sha256: hash.digest("hex"),
      });
    }

    // Documents rendered by the documents feature, each an issued document with its own verification code.
    // They are issued without a history event each: the one "archive exported" event per object names them.
    // A document that fails to render is left out and said so; the rest of the ZIP still builds.
    const issued = new Map<string, { kind: string; code: string; file: string }[]>();
    const failed: string[] = [];
    const issue = async (objectId: string, what: string, file: string, kind: string, caption: string, make: () => Promise<{ pdf: Buffer; code: string }>) => {
      try {
        const { pdf, code } = await make();
        put(pdf, { file, kind, objectNumber: byId.get(objectId)!.objectNumber, caption: `${caption} · verification code ${code}` });
        issued.set(objectId, [...(issued.get(objectId) ?? []), { kind, code, file }]);
      } catch {
        failed.push(what);
        total--;
      }
    };
    const quiet = { inHistory: false };
    for (const o of objs) {
      const n = safeSegment(o.objectNumber);
      await issue(o.id, `the dossier of ${o.objectNumber}`, `dossiers/${n}.pdf`, "object dossier", `Object dossier of ${o.objectNumber}`, () =>
        issueDossier(db, config, clock, user, o.id, quiet),
      );
    }
    const seq = (m: Map<string, number>, key: string) => {
      const v = (m.get(key) ?? 0) + 1;
      m.set(key, v);
      return v > 1 ? `-${v}` : "";
    };
    const reportSeq = new Map<string, number>();
    for (const r of reportRows) {
      const n = safeSegment(byId.get(r.objectId)!.objectNumber);
      const file = `condition-reports/${n}-${r.date}${seq(reportSeq, `${n}-${r.date}`)}.pdf`;
      await issue(r.objectId, `the condition report of ${byId.get(r.objectId)!.objectNumber} of ${r.date}`, file, "condition report", `Condition report of ${r.date}`, () =>
        issueConditionReport(db, config, clock, user, r.id, quiet),
      );
    }
    const receiptSeq = new Map<string, number>();
    for (const c of receiptRows) {
      const n = safeSegment(byId.get(c.objectId)!.objectNumber);
      const file = `custody-receipts/${n}-${c.date}-${c.kind}${seq(receiptSeq, `${n}-${c.date}-${c.kind}`)}.pdf`;
      const what = label(CUSTODY_KIND_LABELS, c.kind) ?? c.kind;
      await issue(c.objectId, `the custody receipt of ${byId.get(c.objectId)!.objectNumber} of ${c.date}`, file, "custody receipt", `Custody receipt: ${what}, ${c.date}`, () =>
        issueCustodyReceipt(db, clock, config.uploadsDir, user, c.id, quiet),
      );
    }

    // The manifest lists every other file; it cannot hold its own hash.
    const manifestTable = {
      columns: [...MANIFEST_COLUMNS],
      rows: manifest.map((m) => ({ File: m.file, Kind: m.kind, "Object number": m.objectNumber, Caption: m.caption, Bytes: m.bytes, "SHA-256": m.sha256 })),
    };
    archive.append(toCsv(manifestTable), { name: "manifest.csv" });
    archive.append(JSON.stringify(manifest, null, 2), { name: "manifest.json" });
    await archive.finalize();
    await closed;

    // One "archive exported" event per object in the ZIP, written once the ZIP is whole, naming what of the
    // object went in. Single CSV/JSON downloads write none: one event per object for every spreadsheet
    // download would bury the history.
    // Written 200 objects to a transaction, letting other requests in between: 5,000 events in one
    // transaction hold the request thread for over half a second.
    const at = clock();
    const photosOf = new Map<string, number>();
    for (const f of files) photosOf.set(f.objectId, (photosOf.get(f.objectId) ?? 0) + 1);
    for (let i = 0; i < objs.length; i += EVENTS_PER_TRANSACTION) {
      if (i > 0) await new Promise((resume) => setImmediate(resume));
      inTransaction(db, (tx) => {
        for (const o of objs.slice(i, i + EVENTS_PER_TRANSACTION)) {
          const docs = issued.get(o.id) ?? [];
          const photoCount = photosOf.get(o.id) ?? 0;
          const parts = [
            ...(["object dossier", "condition report", "custody receipt"] as const).map((k) => {
              const of = docs.filter((d) => d.kind === k);
              const [only] = of;
              return only === undefined ? null : of.length === 1 ? `${k} ${only.code}` : `${of.length} ${k}s (${of.map((d) => d.code).join(", ")})`;
            }),
            photoCount ? `${photoCount} photo${photoCount === 1 ? "" : "s"}` : null,
          ].filter(Boolean);
          appendEvent(tx, {
            objectId: o.id,
            type: "exported",
            actor: { id: user.id, name: user.name },
            at,
            summary: `Included in an archive of ${client.name}'s records: ${parts.length ? parts.join(", ") : "its catalogue data"}.`,
            data: { jobId: job.id, datasets: [...datasets], photos: photoCount, documents: docs },
          });
        }
      });
    }
    const count = (k: string) => [...issued.values()].flat().filter((d) => d.kind === k).length;
    job.state = "done";
    job.progress = 1;
    building.delete(job.id);
    job.message =
      `Ready: ${objs.length} objects, ${files.length} photos, ${count("object dossier")} dossiers, ${count("condition report")} condition reports, ${count("custody receipt")} custody receipts, and a manifest with each file's SHA-256.` +
      (missing ? ` ${missing} photo file${missing === 1 ? " was" : "s were"} missing from storage and left out.` : "") +
      (failed.length ? ` Left out because it could not be made: ${failed.join("; ")}.` : "");
    save(job);
  }

  return {
    startArchive(user: SessionUser, client: ClientRecord, opts: { originals?: boolean } = {}): string {
      if (opts.originals && !isStudio(user))
        throw forbidden("Original photo files, with their camera and place metadata, go only to studio staff. Leave out originals to get the full-size copies.");
      // One archive at a time per client: a second would only compete with the first for the same files.
      const busy = repo.jobs.runningFor(client.id);
      if (busy)
        throw conflict(`An archive of ${client.name}'s records is being built already. Wait for it to finish (it is kept for an hour), then start another if you need one.`);
      const id = randomUUID();
      const dir = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-export-"));
      const job: Job = {
        id,
        ownerId: user.id,
        clientId: client.id,
        originals: !!opts.originals,
        state: "running",
        progress: 0,
        message: "Starting.",
        createdAt: clock().getTime(),
        dir,
        file: path.join(dir, "export.zip"),
        filename: `${slug(client.name)}-records-${clock().toISOString().slice(0, 10)}.zip`,
        // Removes the job and its file after an hour; unref'd so it never holds the process open.
        timer: setTimeout(() => void expire({ id, dir }), JOB_TTL_MS).unref(),
      };
      repo.jobs.insert({
        id,
        ownerId: user.id,
        clientId: client.id,
        state: "running",
        progress: 0,
        message: job.message,
        originals: job.originals,
        dir,
        file: job.file,
        filename: job.filename,
        createdAtMs: job.createdAt,
      });
      building.set(id, job);
      setImmediate(() => {
        run(job, user, client).catch(async (err: unknown) => {
          job.state = "failed";
          job.message = "The export could not be built. Try again; if it fails again, tell the studio's administrator.";
          job.error = err;
          building.delete(job.id);
          save(job);
          await fsp.rm(job.file, { force: true }).catch(() => {});
        });
      });
      return id;
    },

    status(user: SessionUser, jobId: string): JobStatus {
      const { state, progress, message } = ownJob(user, jobId);
      return { state, progress, message };
    },

    download(user: SessionUser, jobId: string): { file: string; filename: string } {
      const job = ownJob(user, jobId);
      if (job.state !== "done") throw conflict(job.state === "failed" ? "This export failed; start a new one." : "This export is still being built; try again when it is done.");
      return { file: job.file, filename: job.filename };
    },

    /** For shutdown and tests: removes every job and its file. */
    async clear() {
      await Promise.all(repo.jobs.all().map(expire));
    },
  };
}
