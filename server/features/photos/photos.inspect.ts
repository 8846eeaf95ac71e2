import fsp from "node:fs/promises";
import sharp, { type Metadata } from "sharp";
import exifr from "exifr";
import { fileTypeFromFile } from "file-type";
import { PHOTO_TYPES } from "../../../shared/schemas/photos.ts";
import type { Config } from "../../lib/config.ts";
import { AppError } from "../../lib/errors.ts";
import type { StorageExt } from "../../lib/storage.ts";

sharp.cache(false);

export type PhotoLimits = Pick<Config, "maxUploadMb" | "maxUploadMegapixels">;
export type AcceptedMime = keyof typeof PHOTO_TYPES;

/** The largest side of each served version; `full` keeps the photo's own size. */
export const VERSION_MAX_SIDE = { web: 2048, thumb: 400 } as const;

export const MB = 1024 * 1024;
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
  const ext = /\.([A-Za-z0-9]{1,8})$/.exec(declared.originalName.trim())?.[1]?.toLowerCase();
  if (ext) {
    const mime = EXT_MIME[ext];
    out.push({ mime: mime ?? `.${ext}`, said: mime ? typeName(mime) : `a “.${ext}” file` });
  }
  const mt = (declared.mimetype.toLowerCase().split(";")[0] ?? "").trim();
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
  const [, y = 0, mo = 0, d = 0, h = 0, mi = 0, s = 0] = m.map(Number);
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
