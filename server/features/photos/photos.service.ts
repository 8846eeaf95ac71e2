import { can } from "../../../shared/permissions.ts";
import fsp from "node:fs/promises";
import sharp, { type Metadata, type Sharp, type SharpOptions } from "sharp";
import exifr from "exifr";
import { fileTypeFromFile } from "file-type";
import type { Db } from "../../db/client.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import {
  PHOTO_TYPES,
  PHOTO_VERSIONS,
  PhotoUploadSchema,
  type Photo,
  type PhotoKind,
  type PhotoVersion,
} from "../../../shared/schemas/photos.ts";
import type { Config } from "../../lib/config.ts";
import { AppError, notFound, validationError } from "../../lib/errors.ts";
import type { Storage, StorageExt } from "../../lib/storage.ts";
import { assertCan } from "../../middleware/require-permission.ts";
import { findObject } from "../objects/objects.repo.ts";
import * as repo from "./photos.repo.ts";

// libvips' operation cache keeps decoded tiles of recent images; with photos of 20+ megapixels
// that is memory spent for nothing, since each upload is processed once.
sharp.cache(false);

export type PhotoLimits = Pick<Config, "maxUploadMb" | "maxUploadMegapixels">;
export type AcceptedMime = keyof typeof PHOTO_TYPES;

/** The largest side of each served version; `full` keeps the photo's own size. */
export const VERSION_MAX_SIDE = { web: 2048, thumb: 400 } as const;

const MB = 1024 * 1024;
const MIME_EXT: Record<AcceptedMime, StorageExt> = { "image/jpeg": "jpg", "image/png": "png", "image/webp": "webp", "image/tiff": "tif" };
const SHARP_FORMAT: Record<AcceptedMime, string> = { "image/jpeg": "jpeg", "image/png": "png", "image/webp": "webp", "image/tiff": "tiff" };
const ACCEPTED_SENTENCE = "Reversa accepts JPEG, PNG, WebP and TIFF photographs.";

/** How a type reads in a sentence: "a JPEG image", "an SVG drawing". */
const TYPE_NAMES: Record<string, string> = {
  "image/jpeg": "a JPEG image",
  "image/png": "a PNG image",
  "image/webp": "a WebP image",
  "image/tiff": "a TIFF image",
  "image/gif": "a GIF image",
  "image/bmp": "a BMP image",
  "image/heic": "a HEIC image",
  "image/heif": "a HEIF image",
  "image/avif": "an AVIF image",
  "image/jxl": "a JPEG XL image",
  "image/jp2": "a JPEG 2000 image",
  "image/x-icon": "an icon file",
  "image/vnd.adobe.photoshop": "a Photoshop document",
  "image/x-adobe-dng": "a DNG raw file",
  "image/x-canon-cr2": "a Canon raw file (CR2)",
  "image/x-canon-cr3": "a Canon raw file (CR3)",
  "image/x-nikon-nef": "a Nikon raw file (NEF)",
  "image/x-sony-arw": "a Sony raw file (ARW)",
  "image/x-fujifilm-raf": "a Fujifilm raw file (RAF)",
  "image/x-olympus-orf": "an Olympus raw file (ORF)",
  "image/x-panasonic-rw2": "a Panasonic raw file (RW2)",
  "image/svg+xml": "an SVG drawing",
  "application/pdf": "a PDF document",
  "application/zip": "a ZIP archive",
  "application/xml": "an XML document",
  "text/plain": "a text file",
  "text/html": "a web page (HTML)",
  "video/mp4": "an MP4 video",
  "video/quicktime": "a QuickTime video",
};
const EXT_MIME: Record<string, string> = {
  jpg: "image/jpeg",
  jpeg: "image/jpeg",
  jpe: "image/jpeg",
  jfif: "image/jpeg",
  jif: "image/jpeg",
  png: "image/png",
  webp: "image/webp",
  tif: "image/tiff",
  tiff: "image/tiff",
  gif: "image/gif",
  bmp: "image/bmp",
  heic: "image/heic",
  heif: "image/heif",
  avif: "image/avif",
  jxl: "image/jxl",
  jp2: "image/jp2",
  psd: "image/vnd.adobe.photoshop",
  dng: "image/x-adobe-dng",
  cr2: "image/x-canon-cr2",
  cr3: "image/x-canon-cr3",
  nef: "image/x-nikon-nef",
  arw: "image/x-sony-arw",
  raf: "image/x-fujifilm-raf",
  orf: "image/x-olympus-orf",
  rw2: "image/x-panasonic-rw2",
  svg: "image/svg+xml",
  pdf: "application/pdf",
  zip: "application/zip",
  xml: "application/xml",
  txt: "text/plain",
  html: "text/html",
  htm: "text/html",
  mp4: "video/mp4",
  mov: "video/quicktime",
};
// The mime types that say nothing about the content.
const VAGUE_MIME = new Set(["", "application/octet-stream", "binary/octet-stream", "application/unknown"]);

const typeName = (mime: string) => TYPE_NAMES[mime] ?? `a file of type ${mime}`;
const isAccepted = (mime: string): mime is AcceptedMime => Object.hasOwn(PHOTO_TYPES, mime);

export function fileProblem(message: string): AppError {
  return new AppError("validation_failed", message, { file: message });
}

export function tooLarge(maxUploadMb: number): AppError {
  const message = `This file is larger than ${maxUploadMb.toLocaleString("en-GB")} MB, the most Reversa accepts for one photo. Export it at a smaller size or as a JPEG, then upload it again.`;
  return new AppError("payload_too_large", message, { file: message });
}

/** What the client said the file is: by its name's ending and by the type its browser sent. */
export type DeclaredFile = { originalName: string; mimetype: string };

type Claim = { mime: string; said: string };

function claims(declared: DeclaredFile): Claim[] {
  const out: Claim[] = [];
  const m = /\.([A-Za-z0-9]{1,8})$/.exec(declared.originalName.trim());
  if (m) {
    const ext = m[1].toLowerCase();
    const mime = EXT_MIME[ext];
    out.push({ mime: mime ?? `.${ext}`, said: mime ? typeName(mime) : `a “.${ext}” file` });
  }
  const mt = declared.mimetype.toLowerCase().split(";")[0].trim();
  if (!VAGUE_MIME.has(mt)) out.push({ mime: mt === "image/jpg" || mt === "image/pjpeg" ? "image/jpeg" : mt, said: typeName(mt) });
  return out;
}

/** Reads the start of a file that has no known binary signature, to say what it is in words. */
async function describeUnknown(file: string): Promise<string> {
  const fh = await fsp.open(file, "r");
  try {
    const { buffer, bytesRead } = await fh.read(Buffer.alloc(4096), 0, 4096, 0);
    const head = buffer.subarray(0, bytesRead);
    const text = head.toString("utf8");
    if (/<svg[\s>]/i.test(text)) return "an SVG drawing";
    if (/^\s*<!doctype html|<html[\s>]/i.test(text)) return "a web page (HTML)";
    if (/^\s*<\?xml/i.test(text)) return "an XML document";
    // No NUL bytes and valid UTF-8 (no replacement characters) reads as text.
    if (!head.includes(0) && !text.includes("\uFFFD")) return "text";
    return "a kind of file Reversa cannot read as an image";
  } finally {
    await fh.close();
  }
}

export type UploadInfo = {
  mime: AcceptedMime;
  ext: StorageExt;
  width: number;
  height: number;
  /** Has transparency: its versions are PNG so the transparency is not lost. */
  hasAlpha: boolean;
  /** EXIF DateTimeOriginal as local time, with its offset when the camera wrote one. */
  takenAt: string | null;
};

/** "2026:11:20 14:03:05" (+ "+01:00") → "2026-11-20T14:03:05+01:00"; null for blank or impossible values. */
export function exifDateToIso(value: unknown, offset?: unknown): string | null {
  if (typeof value !== "string") return null;
  const m = /^(\d{4}):(\d{2}):(\d{2})[ T](\d{2}):(\d{2}):(\d{2})/.exec(value.trim());
  if (!m) return null;
  const [, y, mo, d, h, mi, s] = m.map(Number);
  if (y < 1826 || mo < 1 || mo > 12 || d < 1 || d > 31 || h > 23 || mi > 59 || s > 60) return null;
  const iso = `${m[1]}-${m[2]}-${m[3]}T${m[4]}:${m[5]}:${m[6]}`;
  const off = typeof offset === "string" && /^[+-]\d{2}:\d{2}$/.test(offset.trim()) ? offset.trim() : "";
  return iso + off;
}

async function readTakenAt(file: string): Promise<string | null> {
  try {
    const tags = await exifr.parse(file, { reviveValues: false, pick: ["DateTimeOriginal", "OffsetTimeOriginal"] });
    return exifDateToIso(tags?.DateTimeOriginal, tags?.OffsetTimeOriginal);
  } catch {
    // No EXIF, or EXIF exifr cannot read (WebP): the date is simply unknown.
    return null;
  }
}

/**
 * Judges an uploaded file from its bytes: the real type (file-type), agreement with what the client
 * declared, and the pixel count from the header, all before anything is decoded.
 */
export async function inspectUpload(file: string, declared: DeclaredFile, limits: Pick<PhotoLimits, "maxUploadMegapixels">): Promise<UploadInfo> {
  const detected = await fileTypeFromFile(file);
  const real = detected?.mime;
  const declaredClaims = claims(declared);
  const saidImage = declaredClaims.find((c) => isAccepted(c.mime));

  if (!real || !isAccepted(real)) {
    const what = real && real !== "application/xml" ? typeName(real) : await describeUnknown(file);
    const hint = what.includes("raw file") ? " Export it from your raw converter as a TIFF or JPEG first." : "";
    if (saidImage) throw fileProblem(`This file says it is ${saidImage.said}, but its contents are ${what === "text" ? "text, not an image" : what}. ${ACCEPTED_SENTENCE}${hint}`);
    throw fileProblem(`This file is ${what === "text" ? "text, not an image" : what}. ${ACCEPTED_SENTENCE}${hint}`);
  }

  const mismatch = declaredClaims.find((c) => c.mime !== real);
  if (mismatch) {
    const ext = PHOTO_TYPES[real][0];
    throw fileProblem(`This file says it is ${mismatch.said}, but its contents are ${typeName(real)}. Rename it to end in .${ext}, then upload it again.`);
  }

  let meta: Metadata;
  try {
    // metadata() reads the header only; nothing is decoded yet.
    meta = await sharp(file, { limitInputPixels: false }).metadata();
  } catch {
    throw fileProblem(`This file starts like ${typeName(real)} but cannot be read; it may be damaged or incomplete. Export it again, then upload it.`);
  }
  if (meta.format !== SHARP_FORMAT[real] || !meta.width || !meta.height) {
    throw fileProblem(`This file starts like ${typeName(real)} but its contents do not read as one. Export it again, then upload it.`);
  }
  const width = meta.autoOrient?.width ?? meta.width;
  const height = meta.autoOrient?.height ?? meta.height;
  const megapixels = (meta.width * meta.height) / 1e6;
  if (megapixels > limits.maxUploadMegapixels) {
    const mp = megapixels >= 10 ? Math.round(megapixels).toLocaleString("en-GB") : megapixels.toFixed(1);
    throw fileProblem(
      `This image is ${meta.width.toLocaleString("en-GB")} × ${meta.height.toLocaleString("en-GB")} pixels (${mp} megapixels); Reversa accepts photos of up to ${limits.maxUploadMegapixels.toLocaleString("en-GB")} megapixels. Reduce its size, then upload it again.`,
    );
  }
  return { mime: real, ext: MIME_EXT[real], width, height, hasAlpha: !!meta.hasAlpha, takenAt: await readTakenAt(file) };
}

export type RenderedVersions = { ext: "jpg" | "png"; mime: "image/jpeg" | "image/png"; /** The file written at `fullTo`. */ fullFile: string; full: { bytes: number }; web: Buffer; thumb: Buffer };

/**
 * Makes the served versions from the original, one pipeline after another, read from the file:
 * `full` (same size), `web` and `thumb` (fit inside their box), turned upright by the EXIF orientation,
 * converted to sRGB and without any metadata (sharp writes none unless asked: no EXIF, GPS, XMP, IPTC,
 * or ICC profile). JPEG, or PNG when the photo has transparency. The full version goes to the file
 * `fullTo` (a temporary path the caller removes) rather than into memory: at 24 megapixels it is
 * 10–15 MB, and libvips' growing output buffer would hold two or three times that.
 */
export async function renderVersions(
  file: string,
  info: Pick<UploadInfo, "hasAlpha">,
  limits: Pick<PhotoLimits, "maxUploadMegapixels">,
  fullTo: string,
): Promise<RenderedVersions> {
  const input: SharpOptions = { limitInputPixels: Math.floor(limits.maxUploadMegapixels * 1e6), failOn: "error", sequentialRead: true };
  const png = info.hasAlpha;
  // Huffman optimisation of the full version keeps every DCT coefficient of the image in memory
  // (about 150 MB at 24 megapixels) and triples the time, for files some 5% smaller: not worth it.
  const encode = (s: Sharp, v: PhotoVersion) =>
    png
      ? s.png({ compressionLevel: v === "full" ? 4 : 8, adaptiveFiltering: v !== "full" })
      : s.jpeg({ quality: v === "full" ? 92 : v === "web" ? 85 : 80, optimiseCoding: v !== "full", chromaSubsampling: v === "full" ? "4:4:4" : "4:2:0" });
  const box = (side: number) => ({ width: side, height: side, fit: "inside" as const, withoutEnlargement: true });
  try {
    const full = await encode(sharp(file, input).autoOrient(), "full").toFile(fullTo);
    const web = await encode(sharp(file, input).autoOrient().resize(box(VERSION_MAX_SIDE.web)), "web").toBuffer();
    // The web version is already upright and small: the thumbnail comes from it, not from the original.
    const thumb = await encode(sharp(web).resize(box(VERSION_MAX_SIDE.thumb)), "thumb").toBuffer();
    return { ext: png ? "png" : "jpg", mime: png ? "image/png" : "image/jpeg", fullFile: fullTo, full: { bytes: full.size }, web, thumb };
  } catch (e) {
    await fsp.rm(fullTo, { force: true });
    if (e instanceof AppError) throw e;
    throw fileProblem("This image cannot be read to the end; it may be damaged or incomplete. Export it again, then upload it.");
  }
}

/** One upload at a time per process: each holds a decoded photo, and parallel uploads would add up. */
function createQueue(slots: number) {
  let running = 0;
  const waiting: (() => void)[] = [];
  return async function run<T>(job: () => Promise<T>): Promise<T> {
    if (running >= slots) await new Promise<void>((resolve) => waiting.push(resolve));
    running++;
    try {
      return await job();
    } finally {
      running--;
      waiting.shift()?.();
    }
  };
}
const processing = createQueue(1);

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
      if (file.size === 0) throw fileProblem("This file is empty (0 bytes), so there is no photo in it. Choose the file again; if it is still empty, export it again from the camera or scanner.");
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
      return { items: repo.listForObject(db, objectId, reportId).filter((p) => seesPhoto(user, { reportId: p.reportId, clientId: o.clientId })).map(toPhoto) };
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
