import { eq } from "drizzle-orm";
import type { Db } from "../../db/client.ts";
import { studioSettings } from "../../db/schema.ts";
import type { StudioSettings } from "../../../shared/schemas/settings.ts";

export const DEFAULT_SETTINGS: StudioSettings = {
  studioName: "My framing studio",
  studioAddress: null,
  unit: "mm",
  vocabulary: "mount",
  paperSize: "A4",
  currency: "GBP",
  minOverlapMm: 5,
  rebateClearanceMm: 2,
};

export function getSettings(db: Db): StudioSettings {
  const row = db.select().from(studioSettings).where(eq(studioSettings.id, 1)).get();
  if (!row) return DEFAULT_SETTINGS;
  const { id: _id, createdAt: _c, updatedAt: _u, ...rest } = row;
  return rest;
}

export function saveSettings(db: Db, s: StudioSettings): StudioSettings {
  db.insert(studioSettings)
    .values({ id: 1, ...s })
    .onConflictDoUpdate({ target: studioSettings.id, set: { ...s, updatedAt: new Date() } })
    .run();
  return getSettings(db);
}
