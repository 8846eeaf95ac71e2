// Keeps imports running one way (DEVELOPERS.md, Architecture): shared/ imports neither src/ nor server/;
// src/ and server/ never import each other; client features do not import other features.
import fs from "node:fs";
import path from "node:path";

const problems: string[] = [];
function walk(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    return e.isDirectory() ? walk(p) : /\.(ts|tsx)$/.test(e.name) ? [p] : [];
  });
}
const IMPORT = /(?:import|export)[^'"]*?from\s+["']([^"']+)["']|import\(\s*["']([^"']+)["']\s*\)/g;

for (const file of [...walk("shared"), ...walk("server"), ...walk("src")]) {
  const text = fs.readFileSync(file, "utf8");
  const top = file.split(path.sep)[0];
  for (const m of text.matchAll(IMPORT)) {
    const spec = m[1] ?? m[2];
    let target: string | null = null;
    if (spec.startsWith(".")) target = path.normalize(path.join(path.dirname(file), spec));
    else if (spec.startsWith("@shared/")) target = path.join("shared", spec.slice(8));
    else if (spec.startsWith("@/")) target = path.join("src", spec.slice(2));
    if (!target) continue;
    const targetTop = target.split(path.sep)[0];
    if (top === "shared" && targetTop !== "shared") problems.push(`${file}: shared/ must not import ${spec}`);
    if (top === "server" && targetTop === "src") problems.push(`${file}: server/ must not import the client (${spec})`);
    if (top === "src" && targetTop === "server") problems.push(`${file}: the client must not import server/ (${spec})`);
    const f = file.match(/^src\/features\/([^/]+)\//);
    const t = target.match(/^src\/features\/([^/]+)\//);
    if (f && t && f[1] !== t[1]) problems.push(`${file}: feature "${f[1]}" imports feature "${t[1]}"; compose them in a page instead`);
  }
}
// Documents set text through server/lib/pdf/text.tsx, so every glyph comes from the embedded font.
for (const file of walk("server")) {
  const text = fs.readFileSync(file, "utf8");
  for (const m of text.matchAll(/import\s*\{([^}]*)\}\s*from\s*["']@react-pdf\/renderer["']/g)) {
    if (m[1].split(",").some((n) => n.trim() === "Text")) problems.push(`${file}: import Text from server/lib/pdf/text.tsx, not from @react-pdf/renderer`);
  }
}
if (problems.length) {
  console.error(problems.join("\n"));
  process.exit(1);
}
console.log("Imports run one way.");
