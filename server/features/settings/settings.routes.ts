import { Router, type RequestHandler } from "express";
import multer from "multer";
import sharp from "sharp";
import { fileTypeFromBuffer } from "file-type";
import { eq, or } from "drizzle-orm";
import type { Db } from "../../db/client.ts";
import { photos } from "../../db/schema.ts";
import type { Config } from "../../lib/config.ts";
import { AppError, notFound } from "../../lib/errors.ts";
import { createStorage, type Storage } from "../../lib/storage.ts";
import { StudioSettingsSchema } from "../../../shared/schemas/settings.ts";
import { requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { getLogoKey, getSettings, saveSettings, setLogoKey } from "./settings.repo.ts";

export const LOGO_MAX_BYTES = 2 * 1024 * 1024;
export const LOGO_MAX_PX = 4000;
/** Logos are stored as PNGs at most this wide: plenty for ~28 pt in a PDF header. */
export const LOGO_STORED_WIDTH = 600;

const logoProblem = (message: string) => new AppError("validation_failed", message, { file: message });

/** Checks an uploaded logo from its bytes and re-encodes it as a small PNG without metadata. */
export async function prepareLogo(bytes: Buffer): Promise<Buffer> {
  const type = await fileTypeFromBuffer(bytes);
  if (!type || (type.mime !== "image/png" && type.mime !== "image/jpeg"))
    throw logoProblem("The logo must be a PNG or JPEG image. Other files, SVG included, are not accepted.");
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
  if (!key) return;
  const used = db
    .select({ id: photos.id })
    .from(photos)
    .where(or(eq(photos.originalKey, key), eq(photos.fullKey, key), eq(photos.webKey, key), eq(photos.thumbKey, key)))
    .get();
  if (!used) await storage.remove(key).catch(() => {});
}

export function settingsRoutes(db: Db, config: Pick<Config, "uploadsDir">) {
  const storage = createStorage(config.uploadsDir);
  const r = Router();
  r.get("/", requirePermission("settings:read"), (_req, res) => {
    res.json(getSettings(db));
  });
  r.put("/", requirePermission("settings:update"), validate({ body: StudioSettingsSchema }), (req, res) => {
    res.json(saveSettings(db, input(req, "body", StudioSettingsSchema)));
  });

  const receive = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: LOGO_MAX_BYTES, files: 1, fields: 2, fieldSize: 1024, parts: 4, headerPairs: 50 },
  }).single("file");
  const receiveLogo: RequestHandler = (req, res, next) => {
    receive(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === "LIMIT_FILE_SIZE") return next(logoProblem("The logo file is larger than 2 MB. Save a smaller PNG or JPEG and retry."));
        if (err.code === "LIMIT_FILE_COUNT" || err.code === "LIMIT_UNEXPECTED_FILE") return next(logoProblem("Send one image, in the form field “file”."));
        return next(logoProblem("The upload form has unexpected fields. Send the logo image only, in the form field “file”."));
      }
      next(logoProblem("The upload did not arrive whole; the connection may have dropped. Try again."));
    });
  };

  r.put("/logo", requirePermission("settings:update"), receiveLogo, async (req, res) => {
    if (!req.file) throw logoProblem("Choose a PNG or JPEG image to upload, in the form field “file”.");
    const png = await prepareLogo(req.file.buffer);
    const stored = await storage.put(png, "png");
    const previous = setLogoKey(db, stored.key);
    if (previous !== stored.key) await removeUnused(db, storage, previous);
    res.json(getSettings(db));
  });

  r.delete("/logo", requirePermission("settings:update"), async (_req, res) => {
    const previous = setLogoKey(db, null);
    await removeUnused(db, storage, previous);
    res.json(getSettings(db));
  });

  // Any signed-in user: the logo is on every document anyway.
  r.get("/logo", async (_req, res) => {
    const key = getLogoKey(db);
    if (!key || !(await storage.exists(key))) throw notFound("The studio's logo");
    res.setHeader("Content-Type", "image/png");
    res.setHeader("Cache-Control", "private, no-cache");
    res.setHeader("X-Content-Type-Options", "nosniff");
    res.sendFile(storage.path(key));
  });
  return r;
}
