import { sql } from "drizzle-orm";
import type { Db } from "./client.ts";
import { custodyReceipts } from "./schema.ts";
import type { CustodyCreate, CustodyKind } from "../../shared/schemas/custody.ts";
import { findObject, findObjectIdByNumber } from "../features/objects/objects.repo.ts";
import { moveObject } from "../features/custody/custody.repo.ts";
import { dayOf, recordReceipt } from "../features/custody/custody.service.ts";
import type { Actor } from "../features/history/history.chain.ts";

/** The demo's "today": every invented receipt is dated before it. */
const DEMO_TODAY = "2026-12-01";
const STUDIO = "Tidewell & Marr Conservation Framing";

/** Who hands over and signs for each demo owner (all invented). */
const OWNER_PEOPLE: Record<string, string> = {
  "Odile Varga-Pennick": "Odile Varga-Pennick",
  "Wrenfold Hall Collection Trust": "Tomasz Eberlin, Registrar",
  "Benedikt Aalto-Rhee": "Benedikt Aalto-Rhee",
  "Saltmarsh Regional Archive": "Ines Rookwood, Archivist",
};

type Step = { kind: CustodyKind; date: string; condition: string; party?: string; signedBy?: string; location?: string; notes?: string };

/** An intake into the studio, and the return to the owner that ends a visit (the owner hands over and signs). */
const intake = (date: string, condition: string, more: Pick<Step, "notes" | "location"> = {}): Step => ({ kind: "intake", date, condition, ...more });
const returned = (date: string, condition: string, more: Pick<Step, "notes" | "location"> = {}): Step => ({ kind: "return-to-owner", date, condition, ...more });
/** A hand-over to someone other than the owner (a loan, a conservator), who signs for it. */
const handedTo = (kind: CustodyKind, date: string, to: { party: string; signedBy: string }, condition: string, more: Pick<Step, "notes" | "location"> = {}): Step => ({
  kind,
  date,
  ...to,
  condition,
  ...more,
});

/**
 * Invented hand-overs for the demo objects, oldest first, ending in each object's seeded status:
 * an intake within 60 days before 2026-12-01 for everything in the studio, a loan-out for what is on
 * loan, a hand-over to a conservator, and a finished visit for some of the objects now with their owner.
 */
const STEPS: Record<string, Step[]> = {
  "2026-0001": [
    intake("2026-03-02", "Stable; light foxing in the lower margin; old mount acidic, window bevel yellowed."),
    returned("2026-04-10", "Reframed in museum board and UV-filtering glass; no change to the sheet.", { location: "Owner's home, study" }),
    intake("2026-11-18", "Stable; frame knocked at the top left corner in transit, glazing intact."),
  ],
  "2026-0002": [intake("2026-10-06", "Pastel stable on the whole; loose particles along the lower edge inside the old glass.", { notes: "Carried flat, face up, by the owner." })],
  "2026-0003": [
    intake("2026-05-14", "Good; pencil inscription clear; slight cockling at the plate mark."),
    returned("2026-06-02", "Hinged on T-hinges in a new window mount; as received otherwise."),
  ],
  "2026-0004": [intake("2026-11-03", "Albumen print yellowed overall; card mount corners softened; no active flaking.")],
  "2026-0005": [intake("2026-02-20", "Good; small surface scuff in the lower border."), returned("2026-03-12", "Framed; scuff unchanged.")],
  "2026-0006": [intake("2026-11-24", "Good; colour even; no bleeding at the edges.")],
  "2026-0008": [
    intake("2026-08-04", "Good; sheet flat; old tape residue on the back, upper corners."),
    handedTo(
      "loan-out",
      "2026-09-15",
      { party: "Eastharbour Gallery (an invented venue)", signedBy: "Priya Anand-Coll, Exhibitions" },
      "Framed for the loan; sheet as received, tape residue removed.",
      { notes: "Loan agreement held by the owner." },
    ),
  ],
  "2026-0009": [
    intake("2026-10-02", "Fragile; old fold lines with small tears at two folds; light surface dirt.", { notes: "Carried in a rigid folder; two people for the crate." }),
  ],
  "2026-0010": [intake("2026-10-02", "Stable; slight fading along the top edge where the old window sat.")],
  "2026-0013": [intake("2026-10-21", "Image faded to warm brown; sheet stable; no silvering.")],
  "2026-0014": [intake("2026-04-27", "Good; hand colour bright; minor foxing in the top margin."), returned("2026-05-19", "Mounted for the print room; as received otherwise.")],
  "2026-0015": [intake("2026-04-27", "Good; small crease at the lower right corner."), returned("2026-05-19", "Mounted for the print room; crease unchanged.")],
  "2026-0016": [
    intake("2026-07-08", "Silk threads loose in two letters; card support brittle at the edges."),
    handedTo(
      "to-conservator",
      "2026-07-30",
      { party: "Lena Marsh, textile conservator (invented)", signedBy: "Lena Marsh" },
      "As received; packed flat between tissue in a rigid box.",
      { location: "With the textile conservator" },
    ),
  ],
  "2026-0017": [intake("2026-11-09", "Chalk stable; a few particles loose at the lower edge; no smudging.")],
  "2026-0018": [
    intake("2026-06-15", "Good; colour even; no surface marks."),
    handedTo("loan-out", "2026-08-26", { party: "Harbour Lights touring exhibition (invented)", signedBy: "Owen Taverner, Registrar" }, "Framed for touring; print as received.", {
      location: "Touring exhibition, venue 2",
    }),
  ],
  "2026-0019": [intake("2026-10-14", "Good; one corner of the sheet slightly dog-eared.")],
  "2026-0021": [intake("2026-11-27", "Stable; gouache slightly cracked in the sky, not lifting.")],
  "2026-0022": [intake("2026-10-28", "Good; tone even; sheet flat.")],
  "2026-0023": [
    intake("2026-10-09", "Fragile; old folds with splits at two crossings; edges torn in places.", { notes: "Brought rolled; unrolled on arrival with the owner present." }),
  ],
  "2026-0024": [intake("2026-10-16", "Ink stable; small losses along the old fold; seal intact.")],
  "2026-0025": [
    intake("2026-01-19", "Good; slight silvering at the edges."),
    returned("2026-02-09", "Framed for the reading room display; silvering unchanged.", { location: "Reading room display" }),
  ],
  "2026-0026": [intake("2026-11-12", "Good; light surface dirt; small tear at the top edge.")],
  "2026-0027": [intake("2026-11-12", "Stable; varnish slightly crazed at one corner; plate cracked, old repair.", { notes: "Glass plate: carried in its case, gloves on." })],
  "2026-0029": [intake("2026-11-30", "Charcoal smudged at the lower right before arrival; no loose media.")],
};

/**
 * Writes the demo receipts through the custody service, so each one moves its object and lands in its
 * history. Call after the demo objects exist. Returns how many receipts were written (0 when there already are some).
 */
export function seedCustody(db: Db, actor: Actor): number {
  const existing = db.select({ n: sql<number>`count(*)` }).from(custodyReceipts).get()?.n ?? 0;
  if (existing > 0) return 0;
  const now = new Date();
  const today = dayOf(now) > DEMO_TODAY ? dayOf(now) : DEMO_TODAY;
  let written = 0;
  for (const [objectNumber, steps] of Object.entries(STEPS)) {
    const id = findObjectIdByNumber(db, objectNumber);
    const o = id ? findObject(db, id) : null;
    if (!o) continue;
    const owner = OWNER_PEOPLE[o.clientName] ?? o.clientName;
    const finalStatus = o.status;
    const finalLocation = o.location;
    // The seed recorded each object with its status of today; before the first receipt it was with its owner.
    moveObject(db, o.id, o.version, { status: "with-owner" });
    steps.forEach((s, i) => {
      const last = i === steps.length - 1;
      const inward = s.kind === "intake" || s.kind === "loan-return" || s.kind === "from-conservator";
      const other = s.party ?? owner;
      const body: CustodyCreate = {
        kind: s.kind,
        date: s.date,
        fromParty: inward ? other : STUDIO,
        toParty: inward ? `${STUDIO} (${actor.name})` : other,
        condition: s.condition,
        signedBy: s.signedBy ?? owner,
        // The last hand-over leaves the object where the demo catalogue says it is.
        location: s.location ?? (last ? finalLocation : null),
        notes: s.notes ?? null,
      };
      recordReceipt(db, o.id, body, actor, now, today);
      written++;
    });
    const after = findObject(db, o.id);
    if (after && after.status !== finalStatus) throw new Error(`Demo custody for ${objectNumber} ends ${after.status}, not ${finalStatus}.`);
  }
  return written;
}
