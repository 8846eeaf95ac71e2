import fsp from "node:fs/promises";
import sharp, { type Sharp, type SharpOptions } from "sharp";
import type { PhotoVersion } from "../../../shared/schemas/photos.ts";
import { AppError } from "../../lib/errors.ts";
import { type PhotoLimits, type UploadInfo, VERSION_MAX_SIDE, fileProblem } from "./photos.inspect.ts";

export type RenderedVersions = {
  ext: "jpg" | "png";
  mime: "image/jpeg" | "image/png" /** The file written at `fullTo`. */;
  fullFile: string;
  full: { bytes: number };
  web: Buffer;
  thumb: Buffer;
};

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
export const processing = createQueue(1);
