import fs from "node:fs";
import path from "node:path";

/** Every file under a folder, as sorted paths relative to it (none when the folder does not exist). */
export function filesUnder(root: string): string[] {
  if (!fs.existsSync(root)) return [];
  return (fs.readdirSync(root, { recursive: true, withFileTypes: true }) as fs.Dirent[])
    .filter((e) => e.isFile())
    .map((e) => path.relative(root, path.join(e.parentPath, e.name)))
    .sort();
}
