import fs from "node:fs";
import fsp from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { Router, type RequestHandler } from "express";
import multer from "multer";
import type { Db } from "../../db/client.ts";
import type { Config } from "../../lib/config.ts";
import { IdParamSchema } from "../../../shared/schemas/common.ts";
import { PhotoFileParamsSchema, PhotoListQuerySchema, PhotoUpdateSchema } from "../../../shared/schemas/photos.ts";
import { AppError, notFound } from "../../lib/errors.ts";
import { createStorage } from "../../lib/storage.ts";
import { currentUser } from "../../middleware/require-permission.ts";
import { input, validate } from "../../middleware/validate.ts";
import { createPhotosService } from "./photos.service.ts";
import { fileProblem, tooLarge } from "./photos.inspect.ts";

// Uploads arrive in a private folder of the system's temporary space (made once per process, mode 0700),
// never under uploads/: only the storage module writes there, and only after a file has passed every check.
let tempDir: string | null = null;
export function uploadTempDir(): string {
  if (!tempDir || !fs.existsSync(tempDir)) {
    // The process id is in the name, so the start-up sweep (server/lib/sweep.ts) can tell a dead process's folder.
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), `reversa-upload-${process.pid}-`));
    tempDir = dir;
    process.once("exit", () => fs.rmSync(dir, { recursive: true, force: true }));
  }
  return tempDir;
}

/** Mounted at /api. */
export function photoRoutes(db: Db, config: Pick<Config, "uploadsDir" | "maxUploadMb" | "maxUploadMegapixels">) {
  const storage = createStorage(config.uploadsDir);
  const service = createPhotosService(db, storage, config);
  const r = Router();

  const receive = multer({
    storage: multer.diskStorage({
      destination: (_req, _file, cb) => cb(null, uploadTempDir()),
      // A random name: nothing the client sent reaches a path.
      filename: (_req, _file, cb) => cb(null, randomUUID()),
    }),
    limits: { fileSize: service.maxBytes, files: 1, fields: 8, fieldSize: 4096, parts: 10, headerPairs: 50 },
  }).single("file");

  const receiveFile: RequestHandler = (req, res, next) => {
    receive(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === "LIMIT_FILE_SIZE") return next(tooLarge(config.maxUploadMb));
        if (err.code === "LIMIT_FILE_COUNT" || err.code === "LIMIT_UNEXPECTED_FILE") return next(fileProblem("Send one photo per request, in the form field “file”."));
        return next(new AppError("validation_failed", "The upload form has too many or too long fields. Send the photo with its kind, caption and report only."));
      }
      // busboy: a body cut off or not multipart as it claims.
      next(fileProblem("The upload did not arrive whole; the connection may have dropped. Try again."));
    });
  };

  r.post(
    "/objects/:id/photos",
    validate({ params: IdParamSchema }),
    // Permission first, so bytes from someone who may not add photos never reach the disk.
    (req, _res, next) => {
      service.assertCanUpload(currentUser(req), input(req, "params", IdParamSchema).id);
      next();
    },
    receiveFile,
    async (req, res) => {
      let photo: Awaited<ReturnType<typeof service.upload>>;
      try {
        photo = await service.upload(currentUser(req), input(req, "params", IdParamSchema).id, req.file, req.body);
      } finally {
        // Gone before the answer leaves, refused or not.
        if (req.file) await fsp.rm(req.file.path, { force: true });
      }
      res.status(201).json(photo);
    },
  );

  r.get("/objects/:id/photos", validate({ params: IdParamSchema, query: PhotoListQuerySchema }), (req, res) => {
    res.json(service.listForObject(currentUser(req), input(req, "params", IdParamSchema).id, input(req, "query", PhotoListQuerySchema).reportId));
  });

  r.get("/photos/:id", validate({ params: IdParamSchema }), (req, res) => {
    res.json(service.get(currentUser(req), input(req, "params", IdParamSchema).id));
  });

  r.put("/photos/:id", validate({ params: IdParamSchema, body: PhotoUpdateSchema }), (req, res) => {
    res.json(service.update(currentUser(req), input(req, "params", IdParamSchema).id, input(req, "body", PhotoUpdateSchema)));
  });

  // Bytes only for those who may read the object; 404 for anyone else, as for a photo that does not exist.
  r.get("/photos/:id/:version", validate({ params: PhotoFileParamsSchema }), (req, res, next) => {
    const { id, version } = input(req, "params", PhotoFileParamsSchema);
    const f = service.file(currentUser(req), id, version);
    storage.path(f.key); // refuses anything but a well-formed key before a path is touched
    res.setHeader("Content-Type", f.mime);
    // Never stored by the browser: on a shared computer a signed-out person must not find the photos in its cache.
    res.setHeader("Cache-Control", "private, no-store");
    res.setHeader("X-Content-Type-Options", "nosniff");
    res.setHeader("Content-Disposition", `inline; filename="${f.filename}"`);
    res.sendFile(f.key, { root: storage.root, cacheControl: false, dotfiles: "deny" }, (err) => {
      if (!err) return;
      if (res.headersSent) return void res.destroy();
      req.log?.error({ err, photoId: id, version }, "photo file missing from storage");
      // The row is there but its file is not: say so without the stack.
      res.removeHeader("Content-Disposition");
      res.removeHeader("Cache-Control");
      next(notFound("That photo's file"));
    });
  });

  return r;
}
