import { sql } from "drizzle-orm";
import type { Db } from "./client.ts";
import { user } from "./schema.ts";
import { makeClient, makeObject, makeUser } from "./factories.ts";
import { DEFAULT_STUDIO_SETTINGS, saveSettings } from "../features/settings/settings.repo.ts";
import type { SessionUser } from "../../shared/schemas/auth.ts";
import { appendEvent } from "../features/history/history.chain.ts";
import { seedMountings } from "./seed-mountings.ts";
import { seedCustody } from "./seed-custody.ts";
import { seedCondition } from "./seed-condition.ts";
import { DEMO_OBJECTS } from "./seed-objects/index.ts";

/** The invented demo studio. Every name here is made up for the demo. */
export const DEMO_PASSWORD = "reversa-demo";
export const DEMO_USERS = [
  { email: "admin@reversa.test", name: "Maren Quist", role: "admin" },
  { email: "framer@reversa.test", name: "Jonah Pell", role: "framer" },
  { email: "registrar@reversa.test", name: "Tomasz Eberlin", role: "registrar", client: "wrenfold" },
  { email: "collector@reversa.test", name: "Odile Varga-Pennick", role: "collector", client: "varga" },
] as const;

/** Seeds the demo studio into an empty database. Returns false when the database already has users. */
export async function seedDemo(db: Db): Promise<boolean> {
  const n = db.select({ n: sql<number>`count(*)` }).from(user).get()?.n ?? 0;
  if (n > 0) return false;

  // The demo studio works in the defaults (mm, mount, A4, GBP…): only its name, address, contact and frame sizes are its own.
  saveSettings(db, {
    ...DEFAULT_STUDIO_SETTINGS,
    studioName: "Tidewell & Marr Conservation Framing",
    studioAddress: "Unit 4, Ropewalk Yard, Eastharbour (an invented demo studio)",
    studioContact: "01632 960 417 · bench@tidewell-marr.example",
    framePresets: [
      { label: "Studio stock: 40 × 50 cm", widthMm: 400, heightMm: 500 },
      { label: "Studio stock: 50 × 70 cm", widthMm: 500, heightMm: 700 },
    ],
  });

  const clients = {
    varga: makeClient(db, {
      kind: "private",
      name: "Odile Varga-Pennick",
      contactName: "Odile Varga-Pennick",
      email: "collector@reversa.test",
      phone: "+44 20 7946 0001",
      address: "12 Quillmarsh Row, Eastharbour",
    }),
    wrenfold: makeClient(db, {
      kind: "institution",
      name: "Wrenfold Hall Collection Trust",
      contactName: "Tomasz Eberlin, Registrar",
      email: "registrar@reversa.test",
      phone: "+44 20 7946 0002",
      address: "Wrenfold Hall, Lakeside Lane",
    }),
    aalto: makeClient(db, {
      kind: "private",
      name: "Benedikt Aalto-Rhee",
      contactName: "Benedikt Aalto-Rhee",
      email: "benedikt@example.test",
      address: "Flat 3, 9 Chandler Street",
    }),
    saltmarsh: makeClient(db, {
      kind: "institution",
      name: "Saltmarsh Regional Archive",
      contactName: "Archive office",
      email: "archive@example.test",
      address: "The Old Customs House, Eastharbour",
    }),
  };

  const ids: Record<string, string> = {};
  for (const u of DEMO_USERS) {
    ids[u.role] = await makeUser(db, { email: u.email, name: u.name, role: u.role, clientId: "client" in u ? clients[u.client].id : null, password: DEMO_PASSWORD });
  }
  const framerId = ids.framer;
  if (!framerId) throw new Error("The demo users include no framer.");
  const framer: SessionUser = { id: framerId, name: "Jonah Pell", email: "framer@reversa.test", role: "framer", clientId: null };

  DEMO_OBJECTS.forEach(({ owner, ...o }, i) => {
    const objectNumber = `2026-${String(i + 1).padStart(4, "0")}`;
    const id = makeObject(db, clients[owner].id, { ...o, objectNumber });
    appendEvent(db, { objectId: id, type: "created", actor: framer, summary: `Recorded as ${objectNumber}, “${o.title}”.`, data: { objectNumber } });
  });
  seedMountings(db, framer);
  seedCustody(db, framer);
  seedCondition(db, framer);
  return true;
}
