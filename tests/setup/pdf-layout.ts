import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { spawnSync } from "node:child_process";
import { at, first } from "./lists.ts";

/**
 * Reads a PDF back the way a reader meets it, with poppler: the pages, their size, every word with
 * its box, the fonts. Test-only: the page checks in document-layout.test.ts are built on it.
 */
export type Word = { text: string; xMin: number; yMin: number; xMax: number; yMax: number };
export type Line = { words: Word[]; text: string; yMin: number; yMax: number; height: number };
export type PdfPage = { width: number; height: number; lines: Line[] };

const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-pdf-layout-"));

function run(tool: string, args: string[]): string {
  const r = spawnSync(`/usr/bin/${tool}`, args, { encoding: "utf8", maxBuffer: 256 * 1024 * 1024 });
  if (r.status !== 0) throw new Error(`${tool} failed: ${r.stderr}`);
  return r.stdout;
}

export function pdfFile(pdf: Buffer): string {
  const file = path.join(tmp, `${randomUUID()}.pdf`);
  fs.writeFileSync(file, pdf);
  return file;
}

const num = (tag: string, name: string) => Number(new RegExp(`${name}="([0-9.]+)"`).exec(tag)![1]);
const unescapeXml = (t: string) =>
  t
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'")
    .replace(/&amp;/g, "&");

/** Pages, lines and words with their boxes (points, origin top left), from `pdftotext -bbox-layout`. */
export function pdfPages(pdf: Buffer): PdfPage[] {
  const html = run("pdftotext", ["-bbox-layout", pdfFile(pdf), "-"]);
  const pages: PdfPage[] = [];
  for (const pm of html.matchAll(/<page ([^>]*)>([\s\S]*?)<\/page>/g)) {
    const page: PdfPage = { width: num(at(pm, 1), "width"), height: num(at(pm, 1), "height"), lines: [] };
    for (const lm of at(pm, 2).matchAll(/<line ([^>]*)>([\s\S]*?)<\/line>/g)) {
      const words = [...at(lm, 2).matchAll(/<word ([^>]*)>([\s\S]*?)<\/word>/g)].map((w) => ({
        text: unescapeXml(at(w, 2)),
        xMin: num(at(w, 1), "xMin"),
        yMin: num(at(w, 1), "yMin"),
        xMax: num(at(w, 1), "xMax"),
        yMax: num(at(w, 1), "yMax"),
      }));
      if (!words.length) continue;
      const yMin = num(at(lm, 1), "yMin");
      const yMax = num(at(lm, 1), "yMax");
      page.lines.push({ words, text: words.map((w) => w.text).join(" "), yMin, yMax, height: Math.max(...words.map((w) => w.yMax - w.yMin)) });
    }
    page.lines.sort((a, b) => a.yMin - b.yMin);
    pages.push(page);
  }
  return pages;
}

/** The fonts `pdffonts` lists: name, whether embedded. */
export function pdfFonts(pdf: Buffer): { name: string; embedded: boolean }[] {
  const out = run("pdffonts", [pdfFile(pdf)]);
  return out
    .split("\n")
    .slice(2)
    .filter((l) => l.trim())
    .map((l) => {
      const cols = l.trim().split(/\s+/);
      // name type [encoding] emb sub uni object ID: emb is the fifth column from the end.
      return { name: first(cols, "a pdffonts row"), embedded: cols[cols.length - 5] === "yes" };
    });
}

export function pdfInfo(pdf: Buffer): { pages: number; width: number; height: number } {
  const out = run("pdfinfo", [pdfFile(pdf)]);
  const size = /Page size:\s+([0-9.]+) x ([0-9.]+) pts/.exec(out)!;
  return { pages: Number(/Pages:\s+(\d+)/.exec(out)![1]), width: Number(size[1]), height: Number(size[2]) };
}

/** The first page rendered to a PNG at the given resolution, with pdftoppm. */
export function pageImage(pdf: Buffer, page: number, dpi: number): Buffer {
  const file = pdfFile(pdf);
  const out = path.join(tmp, randomUUID());
  run("pdftoppm", ["-png", "-r", String(dpi), "-f", String(page), "-l", String(page), "-singlefile", file, out]);
  return fs.readFileSync(`${out}.png`);
}
