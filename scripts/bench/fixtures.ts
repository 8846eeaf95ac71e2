// The bench's temporary database: clients, users, objects, mountings and history events, seeded with
// prepared statements (the services would take hours at these sizes), as the services would leave them.
import { randomUUID } from "node:crypto";
import { type DbHandle, openDatabase } from "../../server/db/client.ts";
import { makeClient, makeUser } from "../../server/db/factories.ts";
import { eventHash } from "../../server/features/history/history.chain.ts";
import { boardBatches } from "../../shared/domain/mounting.ts";
import { type MountingDataInput, MountingDataSchema } from "../../shared/schemas/mountings.ts";
import { nth } from "./nth.ts";

// The history key the in-process app and the spawned server use (HISTORY_KEY), so the seeded chains verify.
export const BENCH_HISTORY_KEY_TEXT = "bench-history-key-bench-history-key-0000";
export const BENCH_HISTORY_KEY = Buffer.from(BENCH_HISTORY_KEY_TEXT, "utf8");

export type BenchSizes = { objects: number; events: number; mounted: number };

/** What the measured areas need from the seeded database. */
export type BenchFixtures = {
  database: DbHandle;
  framerId: string;
  adminId: string;
  /** The collector's client, whose collection the document benchmarks use. */
  collectorClientId: string;
  /** Every object's id, in insertion order (rowid); the first has two mountings, a corrected revision and 200 events. */
  objectIds: string[];
};

/** Opens `file` (migrating it) and seeds it at the given sizes. */
export async function seedBench(file: string, sizes: BenchSizes): Promise<BenchFixtures> {
  const database = openDatabase(file);
  const { db, sqlite } = database;
  console.log(`Seeding ${sizes.objects.toLocaleString("en-GB")} objects into ${file} …`);
  const t0 = performance.now();
  const clients = Array.from({ length: 40 }, (_, i) => makeClient(db, { kind: i % 4 === 0 ? "institution" : "private", name: `Bench client ${i + 1}` }));
  const framerId = await makeUser(db, { email: "framer@bench.test", name: "Bench framer", role: "framer", password: "bench-password" });
  const adminId = await makeUser(db, { email: "admin@bench.test", name: "Bench admin", role: "admin", password: "bench-password" });
  /** The collector's client, whose collection the document benchmarks below use. */
  const collectorClient = nth(clients, 3);
  await makeUser(db, { email: "collector@bench.test", name: "Bench collector", role: "collector", clientId: collectorClient.id, password: "bench-password" });
  seedObjects(database, sizes.objects, clients);
  sqlite.pragma("optimize");
  console.log(`Seeded in ${((performance.now() - t0) / 1000).toFixed(1)} s.`);
  const objectIds = (sqlite.prepare("select id from objects order by rowid").all() as { id: string }[]).map((r) => r.id);
  seedMountings(database, sizes.mounted, objectIds, { framerId, adminId });
  seedHistory(database, sizes.events, objectIds, framerId);
  sqlite.pragma("optimize");
  return { database, framerId, adminId, collectorClientId: collectorClient.id, objectIds };
}

const WORDS = "estuary harbour garden pear fern heron meadow lake map rose hawthorn sampler hands orchard tram birch pebbles poster deed crew tide fleet nets quay".split(" ");
const MAKERS = ["Ilse Korrow", "Amadou Fenn", "Hollis Dray", "Cordelia Vane", "Anselm Toller", "Odran Keyes", "Unknown maker", "Ruth Calloway-Ng"];
const TYPES = ["print", "drawing", "watercolour", "pastel", "photograph", "document"];
const STATUSES = ["in-studio", "with-owner", "on-loan", "with-conservator"];

function seedObjects({ sqlite }: DbHandle, count: number, clients: { id: string }[]) {
  const insert = sqlite.prepare(
    `insert into objects (id, object_number, title, maker, object_type, sheet_width_mm, sheet_height_mm, client_id, status, sensitivities, valuation_minor, valuation_currency)
     values (?, ?, ?, ?, ?, ?, ?, ?, ?, '[]', ?, 'GBP')`,
  );
  sqlite.transaction(() => {
    for (let i = 0; i < count; i++) {
      const w = (k: number) => WORDS[(i * 7 + k * 13) % WORDS.length];
      insert.run(
        randomUUID(),
        `${2000 + (i % 27)}-${String(i).padStart(6, "0")}`,
        `${w(1)} ${w(2)} study ${i}`,
        MAKERS[i % MAKERS.length],
        TYPES[i % TYPES.length],
        150 + (i % 600),
        200 + (i % 700),
        nth(clients, i % clients.length).id,
        STATUSES[i % STATUSES.length],
        (i % 1000) * 1000,
      );
    }
  })();
}

// ── Mountings: `count` objects (BENCH_MOUNTINGS) in a completed mount (every fifth object), a fifth of them reframed
// (an earlier, superseded record), half corrected once (revision 2 with another window batch);
// the objects' register columns set as the mountings service sets them. ────────────────────────────
const HINGES = [
  { edge: "top", offsetMm: 40, widthMm: 25 },
  { edge: "top", offsetMm: 145, widthMm: 25 },
] as const;
const MOUNT_KINDS: MountingDataInput[] = [
  { attachment: { method: "t-hinge", adhesive: "wheat-starch-paste", tissue: "Kozo", hinges: [...HINGES] }, grade: "museum", glazing: "uv-glass" },
  { attachment: { method: "corners", hinges: [] }, grade: "conservation", glazing: "ar-uv-glass" },
  { attachment: { method: "v-hinge", adhesive: "wheat-starch-paste", hinges: [...HINGES] }, grade: "museum", glazing: "uv-acrylic" },
  { attachment: { method: "sink-mount", hinges: [] }, grade: "museum", glazing: "float-glass" },
  { attachment: { method: "edge-strips", hinges: [] }, grade: "conservation", glazing: "acrylic" },
].map(({ attachment, grade, glazing }) => ({
  plan: { unit: "mm", sheet: { width: 210, height: 297 }, window: { all: { mode: "overlap", overlap: 5 } }, borders: { all: 60 } },
  boards: { window: { grade, buffered: false, ply: 4, batch: "" }, backing: { grade, buffered: false, ply: 4, batch: "" } },
  attachment,
  glazing: { type: glazing, thicknessMm: 2 },
  undoNotes: "Release the sheet as recorded; nothing else is stuck to it.",
})) as MountingDataInput[];
const isoDay = (ms: number) => new Date(ms).toISOString().slice(0, 10);
const DAY = 86_400_000;
const EPOCH = Date.UTC(2016, 0, 1);
const mountingData = (kind: number, windowBatch: string, backingBatch: string) => {
  const d = structuredClone(nth(MOUNT_KINDS, kind % MOUNT_KINDS.length));
  d.boards.window.batch = windowBatch;
  d.boards.backing.batch = backingBatch;
  return MountingDataSchema.parse(d);
};

function seedMountings({ sqlite }: DbHandle, count: number, objectIds: string[], { framerId, adminId }: { framerId: string; adminId: string }) {
  const tm = performance.now();
  const insMounting = sqlite.prepare(
    `insert into mountings (id, object_id, status, reason, mounted_on, framer_id, framer_name, current_revision, method, board_grade, glazing, superseded_by_id, completed_at, completed_by, ended_on, end_reason, created_by)
     values (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
  );
  const insRevision = sqlite.prepare(
    `insert into mounting_revisions (id, mounting_id, revision, data, correction_reason, created_by, created_by_name) values (?, ?, ?, ?, ?, ?, ?)`,
  );
  const insBatch = sqlite.prepare(`insert into mounting_batches (mounting_id, revision, role, batch) values (?, ?, ?, ?)`);
  const setRegister = sqlite.prepare(
    `update objects set current_mounting_id = ?, current_method = ?, current_board_grade = ?, current_glazing = ?, last_mounted_on = ?, check_due_on = ? where id = ?`,
  );
  let mountingRows = 0;
  let revisionRows = 0;
  let batchRows = 0;
  const step = Math.max(1, Math.floor(objectIds.length / count));
  sqlite.transaction(() => {
    for (let k = 0; k < count && k * step < objectIds.length; k++) {
      const objectId = objectIds[k * step];
      const byAdmin = k % 3 === 0;
      const framer = byAdmin ? { id: adminId, name: "Bench admin" } : { id: framerId, name: "Bench framer" };
      const mountedOnMs = EPOCH + ((k * 7919) % 3300) * DAY + 200 * DAY;
      const mountedOn = isoDay(mountedOnMs);
      const id = randomUUID();
      const writeRevisions = (mid: string, kind: number, revs: [string, string][]) => {
        revs.forEach(([w, b], i) => {
          const data = mountingData(kind, w, b);
          insRevision.run(randomUUID(), mid, i + 1, JSON.stringify(data), i === 0 ? null : "The window board came from another delivery.", framer.id, framer.name);
          revisionRows++;
          for (const x of boardBatches(data)) {
            insBatch.run(mid, i + 1, x.role, x.batch);
            batchRows++;
          }
        });
      };
      if (k % 5 === 0) {
        // The earlier mount, superseded by the current one.
        const old = randomUUID();
        const oldKind = (k + 1) % MOUNT_KINDS.length;
        const d = nth(MOUNT_KINDS, oldKind);
        insMounting.run(
          old,
          objectId,
          "superseded",
          "first-mounting",
          isoDay(mountedOnMs - 1500 * DAY),
          framer.id,
          framer.name,
          1,
          d.attachment.method,
          d.boards.window.grade,
          d.glazing.type,
          id,
          mountedOnMs - 1500 * DAY,
          framer.id,
          mountedOn,
          "Superseded by the reframing.",
          framer.id,
        );
        writeRevisions(old, oldKind, [[`MB-${String((k + 37) % 500).padStart(4, "0")}`, `BB-${String(k % 300).padStart(4, "0")}`]]);
        mountingRows++;
      }
      const kind = k % MOUNT_KINDS.length;
      const d = nth(MOUNT_KINDS, kind);
      const backingBatch = `BB-${String((k * 3) % 300).padStart(4, "0")}`;
      const revs: [string, string][] = [[`MB-${String(k % 500).padStart(4, "0")}`, backingBatch]];
      if (k % 2 === 0) revs.push([`MB-${String((k + 250) % 500).padStart(4, "0")}`, backingBatch]);
      insMounting.run(
        id,
        objectId,
        "completed",
        k % 5 === 0 ? "reframing" : "first-mounting",
        mountedOn,
        framer.id,
        framer.name,
        revs.length,
        d.attachment.method,
        d.boards.window.grade,
        d.glazing.type,
        null,
        mountedOnMs,
        framer.id,
        null,
        null,
        framer.id,
      );
      writeRevisions(id, kind, revs);
      mountingRows++;
      // Checks spread 3 to 10 years after mounting (invented: as if later condition checks had moved them on),
      // so that some thousands are due today and the "due" filter has real work.
      const checkDue = isoDay(mountedOnMs + (3 + (k % 8)) * 365 * DAY);
      setRegister.run(id, d.attachment.method, d.boards.window.grade, d.glazing.type, mountedOn, checkDue, objectId);
    }
  })();
  console.log(
    `Seeded ${mountingRows.toLocaleString("en-GB")} mounting records (${revisionRows.toLocaleString("en-GB")} revisions, ${batchRows.toLocaleString("en-GB")} batch rows) in ${((performance.now() - tm) / 1000).toFixed(1)} s.`,
  );
}

// ── History: `count` events (BENCH_EVENTS) spread over the objects, interleaved in time as a studio's would be, each
// chained to its object's previous event with the real hash, so verifyChains passes. One object in a
// thousand has a long history (200 events), so the history page is read from a deep chain too. ──────
function seedHistory({ sqlite }: DbHandle, count: number, objectIds: string[], framerId: string) {
  const te = performance.now();
  const insEvent = sqlite.prepare(`insert into events (object_id, type, at, actor_id, actor_name, summary, data, prev_hash, hash) values (?, ?, ?, ?, ?, ?, ?, ?, ?)`);
  const LATER_TYPES = ["catalogue-changed", "valued", "plan-saved", "mounted", "condition-reported", "custody-in", "custody-out", "reframed", "mounting-corrected"] as const;
  // Planned events per object: 200 for one in a thousand, 1 to 8 for the rest, then topped up (or trimmed) one
  // event at a time so the total is exactly `count`.
  const counts = objectIds.map((_, i) => (i % 1000 === 0 ? 200 : 1 + ((i * 7) % 8)));
  let planned = counts.reduce((a, b) => a + b, 0);
  for (let i = 1; planned < count; i = (i + 1) % counts.length) {
    if (i % 1000 !== 0) {
      counts[i] = nth(counts, i) + 1;
      planned++;
    }
  }
  for (let i = counts.length - 1; planned > count && i >= 0; i--) {
    while (planned > count && nth(counts, i) > 1) {
      counts[i] = nth(counts, i) - 1;
      planned--;
    }
  }
  const rounds = Math.max(...counts);
  const lastHash: (string | null)[] = new Array(objectIds.length).fill(null);
  let emitted = 0;
  sqlite.transaction(() => {
    for (let round = 0; round < rounds; round++) {
      for (let i = 0; i < objectIds.length && emitted < count; i++) {
        if (round >= (counts[i] ?? 0)) continue;
        const type = round === 0 ? "created" : nth(LATER_TYPES, (i + round) % LATER_TYPES.length);
        const data: Record<string, unknown> =
          type === "created"
            ? { objectNumber: `${2000 + (i % 27)}-${String(i).padStart(6, "0")}` }
            : type === "catalogue-changed"
              ? { changes: [{ path: "location", before: `Rack ${round}`, after: `Rack ${round + 1}` }] }
              : { round };
        const content = {
          objectId: nth(objectIds, i),
          type,
          at: EPOCH + emitted * 60_000,
          actorId: framerId,
          actorName: "Bench framer",
          summary: type === "created" ? "Recorded." : `${type.replace(/-/g, " ")} (${round}).`,
          data,
          prevHash: lastHash[i] ?? null,
        };
        const hash = eventHash(content, BENCH_HISTORY_KEY);
        insEvent.run(content.objectId, content.type, content.at, content.actorId, content.actorName, content.summary, JSON.stringify(data), content.prevHash, hash);
        lastHash[i] = hash;
        emitted++;
      }
    }
    // Each object's head is its newest event's hash, as appendEvent keeps it, so verifyChains also checks the ends.
    const setHead = sqlite.prepare("update objects set history_head = ? where id = ?");
    for (let i = 0; i < objectIds.length; i++) if (lastHash[i]) setHead.run(lastHash[i], objectIds[i]);
  })();
  console.log(`Seeded ${emitted.toLocaleString("en-GB")} history events with chained hashes in ${((performance.now() - te) / 1000).toFixed(1)} s.`);
}
