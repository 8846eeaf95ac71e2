import sharp from "sharp";
import { fileTypeFromBuffer } from "file-type";
import type { Db } from "../../db/client.ts";
import { AppError, notFound } from "../../lib/errors.ts";
import type { Storage } from "../../lib/storage.ts";
import type { StudioSettings } from "../../../shared/schemas/settings.ts";
import { keyInUse } from "../photos/photos.repo.ts";
import { getLogoKey, getSettings, saveSettings, setLogoKey } from "./settings.repo.ts";

export const LOGO_MAX_BYTES = 2 * 1024 * 1024;
export const LOGO_MAX_PX = 4000;
/** Logos are stored as PNGs at most this wide: plenty for ~28 pt in a PDF header. */
export const LOGO_STORED_WIDTH = 600;

export const logoProblem = (message: string) => new AppError("validation_failed", message, { file: message });

/** Checks an uploaded logo from its bytes and re-encodes it as a small PNG without metadata. */
export async function prepareLogo(bytes: Buffer): Promise<Buffer> {
  const type = await fileTypeFromBuffer(bytes);
  if (!type || (type.mime !== "image/png" && type.mime !== "image/jpeg")) throw logoProblem("The logo must be a PNG or JPEG image. Other files, SVG included, are not accepted.");
  let meta: Awaited<ReturnType<ReturnType<typeof sharp>["metadata"]>>;
  try {
    meta = await sharp(bytes).metadata();
  } catch {
    throw logoProblem("That image could not be read; it may be damaged. Save it again as PNG or JPEG and retry.");
  }
  if (!meta.width || !meta.height) throw logoProblem("That image could not be read; it may be damaged. Save it again as PNG or JPEG and retry.");
  if (meta.width > LOGO_MAX_PX || meta.height > LOGO_MAX_PX)
    throw logoProblem(`The logo is ${meta.width} × ${meta.height} pixels; it can be at most ${LOGO_MAX_PX} × ${LOGO_MAX_PX} pixels.`);
  try {
    // sharp drops EXIF, ICC and other metadata unless asked to keep it; rotate() applies the EXIF orientation first.
    return await sharp(bytes, { limitInputPixels: LOGO_MAX_PX * LOGO_MAX_PX })
      .rotate()
      .resize({ width: LOGO_STORED_WIDTH, withoutEnlargement: true })
      .png()
      .toBuffer();
  } catch {
    throw logoProblem("That image could not be read; it may be damaged. Save it again as PNG or JPEG and retry.");
  }
}

/** Removes a replaced logo file unless a photo happens to have the same bytes (storage is by content). */
async function removeUnused(db: Db, storage: Storage, key: string | null) {
  if (key && !keyInUse(db, key)) await storage.remove(key).catch(() => {});
}

/** The studio's settings and logo; the routes have checked "settings:update" for every change. */
export function createSettingsService(db: Db, storage: Storage) {
  return {
    get: () => getSettings(db),
    save: (data: StudioSettings) => saveSettings(db, data),
    /** Checks and re-encodes the logo, stores it, and removes the one it replaces. */
    async setLogo(bytes: Buffer) {
      const stored = await storage.put(await prepareLogo(bytes), "png");
      const previous = setLogoKey(db, stored.key);
      if (previous !== stored.key) await removeUnused(db, storage, previous);
      return getSettings(db);
    },
    async removeLogo() {
      await removeUnused(db, storage, setLogoKey(db, null));
      return getSettings(db);
    },
    /** The stored logo's file, or 404. */
    async logoFile(): Promise<string> {
      const key = getLogoKey(db);
      if (!key || !(await storage.exists(key))) throw notFound("The studio's logo");
      return storage.path(key);
    },
  };
}
