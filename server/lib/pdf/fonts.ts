import { Font } from "@react-pdf/renderer";
import { createRequire } from "node:module";
import path from "node:path";

const require = createRequire(import.meta.url);
let done = false;

/**
 * Libre Franklin from the installed @fontsource files. The .woff files are registered: the .woff2
 * files register and embed without error but render blank pages (seen here; see DEVELOPERS.md, decision log).
 */
export function registerFonts() {
  if (done) return;
  const dir = path.join(path.dirname(require.resolve("@fontsource/libre-franklin/package.json")), "files");
  Font.register({
    family: "Libre Franklin",
    fonts: [400, 600, 700].map((w) => ({ src: path.join(dir, `libre-franklin-latin-${w}-normal.woff`), fontWeight: w })),
  });
  // Words are not hyphenated: dimensions, object numbers and codes stay whole. Only a word too long
  // for any column (a pasted reference, a URL) may break, every few characters, so it wraps inside its cell.
  Font.registerHyphenationCallback(breakLongWord);
  done = true;
}

/** The break points react-pdf may use inside a word: none for words up to 20 characters, else every 8. */
export function breakLongWord(word: string): string[] {
  if (word.length <= 20) return [word];
  const parts: string[] = [];
  for (let i = 0; i < word.length; i += 8) parts.push(word.slice(i, i + 8));
  return parts;
}
