import { eq } from "drizzle-orm";
import type { Db } from "../../db/client.ts";
import { studioSettings } from "../../db/schema.ts";
import type { StudioSettings, StudioSettingsRecord } from "../../../shared/schemas/settings.ts";

export const DEFAULT_SETTINGS: StudioSettingsRecord = {
  studioName: "My framing studio",
  studioAddress: null,
  unit: "mm",
  vocabulary: "mount",
  paperSize: "A4",
  currency: "GBP",
  minOverlapMm: 5,
  rebateClearanceMm: 2,
  checkIntervalMonths: 24,
  checkIntervalOnLoanMonths: 12,
  framePresets: [],
};

// Settings are read on most requests and written rarely: keep the row in memory, per database.
const cache = new WeakMap<Db, StudioSettingsRecord>();

export function getSettings(db: Db): StudioSettingsRecord {
  const cached = cache.get(db);
  if (cached) return cached;
  const row = db.select().from(studioSettings).where(eq(studioSettings.id, 1)).get();
  if (!row) return DEFAULT_SETTINGS;
  const { id: _id, createdAt: _c, updatedAt: _u, ...rest } = row;
  cache.set(db, rest);
  return rest;
}

export function saveSettings(db: Db, update: StudioSettings): StudioSettingsRecord {
  const s: StudioSettingsRecord = { ...update, framePresets: update.framePresets ?? getSettings(db).framePresets };
  db.insert(studioSettings)
    .values({ id: 1, ...s })
    .onConflictDoUpdate({ target: studioSettings.id, set: { ...s, updatedAt: new Date() } })
    .run();
  cache.delete(db);
  return getSettings(db);
}
