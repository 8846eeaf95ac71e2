// `npm run restore -- <backup folder> <empty folder>`: checks a backup against its manifest, then lays it
// out in the empty folder, ready to run with DATABASE_URL and UPLOADS_DIR pointing there.
import { restore } from "../server/lib/backup.ts";

const [from, to] = process.argv.slice(2);
if (!from || !to) {
  console.error("Usage: npm run restore -- <backup folder> <empty folder to restore into>");
  process.exit(2);
}
try {
  const r = await restore({ from, to });
  console.log(`Restored ${r.files} files into ${to}. Start Reversa on it with:\n  DATABASE_URL=${r.databaseUrl} UPLOADS_DIR=${r.uploadsDir} npm start`);
} catch (e) {
  console.error(`Restore failed: ${e instanceof Error ? e.message : String(e)}`);
  process.exit(1);
}
