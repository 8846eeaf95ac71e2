import { z } from "zod";
import { optionalText } from "./common.ts";

export const PHOTO_KINDS = ["recto", "verso", "detail", "raking-light", "uv", "transmitted-light"] as const;
export type PhotoKind = (typeof PHOTO_KINDS)[number];
export const PHOTO_KIND_LABELS: Record<PhotoKind, string> = {
  recto: "Recto (front)",
  verso: "Verso (back)",
  detail: "Detail",
  "raking-light": "Raking light",
  uv: "UV",
  "transmitted-light": "Transmitted light",
};
/** Accepted image types, judged from the file's bytes. */
export const PHOTO_TYPES = { "image/jpeg": ["jpg", "jpeg"], "image/png": ["png"], "image/webp": ["webp"], "image/tiff": ["tif", "tiff"] } as const;
export const PHOTO_VERSIONS = ["full", "web", "thumb"] as const;
export type PhotoVersion = (typeof PHOTO_VERSIONS)[number];

/** Sent with each uploaded file (multipart fields). */
export const PhotoUploadSchema = z.object({
  kind: z.enum(PHOTO_KINDS, { message: "Choose the kind of photo." }),
  caption: optionalText(300),
  reportId: z.string().min(1).max(64).optional(),
});
export const PhotoUpdateSchema = z.object({ kind: z.enum(PHOTO_KINDS), caption: optionalText(300) });

export type Photo = {
  id: string;
  objectId: string;
  reportId: string | null;
  kind: PhotoKind;
  caption: string | null;
  takenAt: string | null;
  mime: string;
  width: number;
  height: number;
  bytes: number;
  sha256: string;
  createdAt: string;
  /** Served only to those who may read the object. */
  urls: Record<PhotoVersion, string>;
};

/** Photos of an object, or of one of its condition reports. */
export const PhotoListQuerySchema = z.object({ reportId: z.string().min(1).max(64).optional() });
/** One stored version of a photo (original, full, web, thumb). */
export const PhotoFileParamsSchema = z.object({ id: z.string().min(1).max(64), version: z.string().min(1).max(16) });
