import { Router, type RequestHandler } from "express";
import multer from "multer";
import type { Db } from "../../db/client.ts";
import type { Config } from "../../lib/config.ts";
import { createStorage } from "../../lib/storage.ts";
import { StudioSettingsSchema } from "../../../shared/schemas/settings.ts";
import { requirePermission } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { createSettingsService, LOGO_MAX_BYTES, logoProblem } from "./settings.service.ts";

export function settingsRoutes(db: Db, config: Pick<Config, "uploadsDir">) {
  const service = createSettingsService(db, createStorage(config.uploadsDir));
  const r = Router();
  r.get("/", requirePermission("settings:read"), (_req, res) => {
    res.json(service.get());
  });
  r.put("/", requirePermission("settings:update"), validate({ body: StudioSettingsSchema }), (req, res) => {
    res.json(service.save(input(req, "body", StudioSettingsSchema)));
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
    res.json(await service.setLogo(req.file.buffer));
  });

  r.delete("/logo", requirePermission("settings:update"), async (_req, res) => {
    res.json(await service.removeLogo());
  });

  // Any signed-in user: the logo is on every document anyway.
  r.get("/logo", async (_req, res) => {
    const file = await service.logoFile();
    res.setHeader("Content-Type", "image/png");
    res.setHeader("Cache-Control", "private, no-cache");
    res.setHeader("X-Content-Type-Options", "nosniff");
    res.sendFile(file);
  });
  return r;
}
