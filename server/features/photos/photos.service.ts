import { can } from "../../../shared/permissions.ts";
import fsp from "node:fs/promises";
import type { Db } from "../../db/client.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import { PHOTO_VERSIONS, PhotoUploadSchema, type Photo, type PhotoKind, type PhotoVersion } from "../../../shared/schemas/photos.ts";
import { AppError, notFound, validationError } from "../../lib/errors.ts";
import type { Storage, StorageExt } from "../../lib/storage.ts";
import { assertCan } from "../../middleware/require-permission.ts";
import { findObject } from "../objects/objects.repo.ts";
import * as repo from "./photos.repo.ts";
import { MB, type PhotoLimits, fileProblem, inspectUpload, tooLarge } from "./photos.inspect.ts";
import { processing, renderVersions } from "./photos.versions.ts";

/** The file multer received, in its temporary folder. */
export type ReceivedFile = { path: string; size: number; originalname: string; mimetype: string };

const photoUrl = (id: string, v: PhotoVersion) => `/api/photos/${encodeURIComponent(id)}/${v}`;

export function toPhoto(row: repo.PhotoRow): Photo {
  return {
    id: row.id,
    objectId: row.objectId,
    reportId: row.reportId,
    kind: row.kind as PhotoKind,
    caption: row.caption,
    takenAt: row.takenAt,
    mime: row.mime,
    width: row.width,
    height: row.height,
    bytes: row.bytes,
    sha256: row.sha256,
    createdAt: row.createdAt.toISOString(),
    urls: Object.fromEntries(PHOTO_VERSIONS.map((v) => [v, photoUrl(row.id, v)])) as Record<PhotoVersion, string>,
  };
}

const VERSION_KEY = { full: "fullKey", web: "webKey", thumb: "thumbKey" } as const satisfies Record<PhotoVersion, keyof repo.PhotoRow>;

export function createPhotosService(db: Db, storage: Storage, limits: PhotoLimits) {
  const maxBytes = limits.maxUploadMb * MB;

  function loadObject(user: SessionUser, objectId: string, action: "object:read" | "photo:write") {
    const o = findObject(db, objectId);
    if (!o) throw notFound("That object");
    assertCan(user, action, { clientId: o.clientId }, { what: "That object" });
    return o;
  }

  function loadPhoto(user: SessionUser, id: string, action: "object:read" | "photo:write") {
    const p = repo.findPhoto(db, id);
    if (!p) throw notFound("That photo");
    assertCan(user, action, { clientId: p.clientId }, { what: "That photo" });
    if (!seesPhoto(user, p)) throw notFound("That photo");
    return p;
  }

  /**
   * A photo taken for a draft condition report is part of that draft: hidden, like the draft itself, from
   * anyone who may not read the draft (shared/permissions.ts: a draft is read by its writers).
   */
  function seesPhoto(user: SessionUser, p: { reportId: string | null; clientId: string }): boolean {
    if (!p.reportId) return true;
    return can(user, "condition:read", { clientId: p.clientId, draft: repo.findReport(db, p.reportId)?.status === "draft" });
  }

  return {
    maxBytes,

    /** Before the body is read: only those who may add photos to this object send bytes to the disk. */
    assertCanUpload(user: SessionUser, objectId: string) {
      loadObject(user, objectId, "photo:write");
    },

    async upload(user: SessionUser, objectId: string, file: ReceivedFile | undefined, fields: unknown): Promise<Photo> {
      loadObject(user, objectId, "photo:write");
      const parsed = PhotoUploadSchema.safeParse(fields ?? {});
      if (!parsed.success) throw validationError(parsed.error);
      const body = parsed.data;
      if (body.reportId) {
        const report = repo.findReport(db, body.reportId);
        if (!report || report.objectId !== objectId) {
          const message = "That condition report is not one of this object's reports.";
          throw new AppError("validation_failed", `Check reportId: ${message}`, { reportId: message });
        }
      }
      if (!file) throw fileProblem("Choose a photo to upload: no file came with the request.");
      if (file.size === 0)
        throw fileProblem("This file is empty (0 bytes), so there is no photo in it. Choose the file again; if it is still empty, export it again from the camera or scanner.");
      if (file.size > maxBytes) throw tooLarge(limits.maxUploadMb);

      const info = await inspectUpload(file.path, { originalName: file.originalname, mimetype: file.mimetype }, limits);
      return processing(async () => {
        // Beside the upload, in the private temporary folder; removed below whatever happens.
        const fullTo = `${file.path}.full`;
        const versions = await renderVersions(file.path, info, limits, fullTo);
        const created: string[] = [];
        const put = async (source: Buffer | { file: string }, ext: StorageExt) => {
          const stored = await storage.put(source, ext);
          if (stored.created) created.push(stored.key);
          return stored;
        };
        try {
          const original = await put({ file: file.path }, info.ext);
          if (original.bytes !== file.size) throw new Error("photos: the stored original differs in size from the upload");
          const full = await put({ file: versions.fullFile }, versions.ext);
          const web = await put(versions.web, versions.ext);
          const thumb = await put(versions.thumb, versions.ext);
          const id = repo.insertPhoto(db, {
            objectId,
            reportId: body.reportId ?? null,
            kind: body.kind,
            caption: body.caption,
            takenAt: info.takenAt,
            mime: info.mime,
            width: info.width,
            height: info.height,
            bytes: original.bytes,
            sha256: original.sha256,
            originalKey: original.key,
            fullKey: full.key,
            webKey: web.key,
            thumbKey: thumb.key,
            uploadedBy: user.id,
          });
          return toPhoto(repo.findPhoto(db, id)!);
        } catch (e) {
          // Files this upload wrote go again, unless a photo row has come to share them meanwhile.
          for (const key of created) if (!repo.keyInUse(db, key)) await storage.remove(key).catch(() => {});
          throw e;
        } finally {
          await fsp.rm(fullTo, { force: true });
        }
      });
    },

    listForObject(user: SessionUser, objectId: string, reportId?: string): { items: Photo[] } {
      const o = loadObject(user, objectId, "object:read");
      return {
        items: repo
          .listForObject(db, objectId, reportId)
          .filter((p) => seesPhoto(user, { reportId: p.reportId, clientId: o.clientId }))
          .map(toPhoto),
      };
    },

    get(user: SessionUser, id: string): Photo {
      return toPhoto(loadPhoto(user, id, "object:read"));
    },

    update(user: SessionUser, id: string, data: { kind: PhotoKind; caption: string | null }): Photo {
      loadPhoto(user, id, "photo:write");
      repo.updatePhoto(db, id, data);
      return toPhoto(repo.findPhoto(db, id)!);
    },

    /**
     * The stored file of one served version. The original is never served: it may carry GPS and
     * other private metadata, and is kept for archive exports only.
     */
    file(user: SessionUser, id: string, version: string): { key: string; mime: string; filename: string } {
      if (!(PHOTO_VERSIONS as readonly string[]).includes(version)) throw notFound("That photo");
      const p = loadPhoto(user, id, "object:read");
      const key = p[VERSION_KEY[version as PhotoVersion]];
      const ext = key.slice(key.lastIndexOf(".") + 1);
      const safeNumber = p.objectNumber.replace(/[^A-Za-z0-9._-]+/g, "-");
      return { key, mime: ext === "png" ? "image/png" : "image/jpeg", filename: `${safeNumber}-${p.kind}-${version}.${ext}` };
    },
  };
}
