import fsp from "node:fs/promises";
import { eq } from "drizzle-orm";
import type { Db } from "../../db/client.ts";
import { studioSettings } from "../../db/schema.ts";
import { createStorage } from "../../lib/storage.ts";
import type { StudioSettings, StudioSettingsRecord } from "../../../shared/schemas/settings.ts";

/** What a studio starts with before anything is saved; the demo seed starts from it too. */
export const DEFAULT_STUDIO_SETTINGS: StudioSettings & Pick<StudioSettingsRecord, "framePresets"> = {
  studioName: "My framing studio",
  studioAddress: null,
  studioContact: null,
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
export const DEFAULT_SETTINGS: StudioSettingsRecord = { ...DEFAULT_STUDIO_SETTINGS, hasLogo: false };

// Settings are read on most requests and written rarely: keep the row in memory, per database.
const cache = new WeakMap<Db, StudioSettingsRecord>();

export function getSettings(db: Db): StudioSettingsRecord {
  const cached = cache.get(db);
  if (cached) return cached;
  const row = db.select().from(studioSettings).where(eq(studioSettings.id, 1)).get();
  if (!row) return DEFAULT_SETTINGS;
  const { id: _id, createdAt: _c, updatedAt: _u, logoKey, ...rest } = row;
  const record: StudioSettingsRecord = { ...rest, hasLogo: !!logoKey };
  cache.set(db, record);
  return record;
}

export function saveSettings(db: Db, update: StudioSettings): StudioSettingsRecord {
  // The logo is not part of the update: it is set and removed only by setLogoKey, and kept here.
  const stored: StudioSettings & Pick<StudioSettingsRecord, "framePresets"> = { ...update, framePresets: update.framePresets ?? getSettings(db).framePresets };
  db.insert(studioSettings)
    .values({ id: 1, ...stored })
    .onConflictDoUpdate({ target: studioSettings.id, set: { ...stored, updatedAt: new Date() } })
    .run();
  cache.delete(db);
  return getSettings(db);
}

/** The storage key of the studio's logo, or null. */
export function getLogoKey(db: Db): string | null {
  return db.select({ logoKey: studioSettings.logoKey }).from(studioSettings).where(eq(studioSettings.id, 1)).get()?.logoKey ?? null;
}

/** Sets (or, with null, clears) the logo; returns the key it replaced. Creates the settings row with the defaults if there is none. */
export function setLogoKey(db: Db, key: string | null): string | null {
  const previous = getLogoKey(db);
  db.insert(studioSettings)
    .values({ id: 1, ...DEFAULT_STUDIO_SETTINGS, logoKey: key })
    .onConflictDoUpdate({ target: studioSettings.id, set: { logoKey: key, updatedAt: new Date() } })
    .run();
  cache.delete(db);
  return previous;
}

/** The logo's PNG bytes for documents, or null when there is none or its file is missing or unreadable. */
export async function getLogo(db: Db, uploadsDir: string | undefined): Promise<Buffer | null> {
  if (!uploadsDir) return null;
  const key = getLogoKey(db);
  if (!key) return null;
  try {
    return await fsp.readFile(createStorage(uploadsDir).path(key));
  } catch {
    return null;
  }
}
