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
  // Words are never split with hyphens in dimensions and object numbers.
  Font.registerHyphenationCallback((word) => [word]);
  done = true;
}
