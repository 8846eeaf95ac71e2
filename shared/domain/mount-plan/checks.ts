import type { Check, MountPlanParsed, SideName, Verdict } from "../../schemas/mount-plan.ts";
import { SIDES } from "../../schemas/mount-plan.ts";
import type { PlanGeometry } from "./plan/types.ts";
import { lightClass } from "../light.ts";

/** The edges the hinges sit on: the top only unless the materials say otherwise. */
export function hingeEdges(input: Pick<MountPlanParsed, "materials">): SideName[] {
  const e = input.materials?.hingeEdge;
  return e === "all-edges" ? [...SIDES] : e === "top-and-sides" ? ["left", "top", "right"] : ["top"];
}

const RANK: Record<Verdict, number> = { pass: 0, warn: 1, fail: 2 };
export function worstVerdict(verdicts: Verdict[]): Verdict {
  return verdicts.reduce<Verdict>((w, v) => (RANK[v] > RANK[w] ? v : w), "pass");
}

const SIDE_WORD: Record<SideName, string> = { left: "left", top: "top", right: "right", bottom: "bottom" };
const list = (items: string[]) => (items.length <= 1 ? items.join("") : `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`);

const SOURCES = {
  overlap: "Common practice (no source); the minimum is a studio setting",
  nedcc: "NEDCC Preservation Leaflet 4.10",
  photo: "ISO 18916 (Photographic Activity Test); ISO 18902; CCAHA, “ISO standards for housing photographs”",
  friable: "State Archives of Florida, framing guidance for pastels and charcoal",
  loc: "Library of Congress, “Matting and Hinging Works of Art on Paper”",
  hinges: "Common practice (no source); Library of Congress, “Matting and Hinging Works of Art on Paper”",
  light: "NEDCC Preservation Leaflet 4.10; NISO Z39.79 as summarised by NEDCC Preservation 101 (very sensitive objects)",
} as const;

/**
 * Hinges wanted for a sheet (docs/trade.md §6): two for a top edge up to 700 mm, and
 * one more for each further 350 mm of it begun — i.e. max(2, ⌈width / 350 mm⌉); and, when the
 * paper's weight is known, at least one hinge for each 40 g of sheet begun. Both are Reversa's
 * rules of thumb for "more hinges as size and weight grow" (Library of Congress guide): common
 * practice (no source).
 */
export const HINGE_EDGE_MM_PER_HINGE = 350;
export const HINGE_GRAMS_PER_HINGE = 40;
export function hingesWanted(
  sheetMm: { width: number; height: number },
  paperWeightGsm?: number | null,
): { count: number; byWidth: number; byWeight: number; grams: number | null } {
  const byWidth = Math.max(2, Math.ceil(sheetMm.width / HINGE_EDGE_MM_PER_HINGE - 1e-9));
  const grams = paperWeightGsm ? (sheetMm.width / 1000) * (sheetMm.height / 1000) * paperWeightGsm : null;
  const byWeight = grams !== null ? Math.ceil(grams / HINGE_GRAMS_PER_HINGE - 1e-9) : 0;
  return { count: Math.max(byWidth, byWeight), byWidth, byWeight, grams };
}

/** Friable media by the catalogue: the flag, a pastel, or a medium named as pastel, charcoal or chalk. */
export function isFriable(obj: { objectType?: string | null; sensitivities?: readonly string[] | null; medium?: string | null }): boolean {
  return (obj.sensitivities ?? []).includes("friable-media") || obj.objectType === "pastel" || /\b(pastels?|charcoal|chalks?|cont[eé] crayon)\b/i.test(obj.medium ?? "");
}

const HINGES = ["t-hinge", "v-hinge", "pendant-hinge", "pass-through-hinge"];
const FLOAT_METHODS = ["v-hinge", "pass-through-hinge", "edge-strips", "polyester-straps", "sink-mount"];
const SENSITIVE_PROCESSES = ["albumen", "salted-paper", "platinum-palladium", "dye-transfer", "collodion"];

/**
 * The eight conservation-level rules of the plan (docs/trade.md §5), each with a verdict, a reason in the framer's words and its source.
 * `length` formats any length in the display unit; `shown` formats a figure that is already on the shown grid; `minimum` is the studio minimum as shown.
 */
export type Formatters = { length: (mm: number, r?: "nearest" | "down" | "up") => string; shown: (mm: number) => string; minimum: () => string };

export function conservationChecks(g: PlanGeometry, input: MountPlanParsed, f: Formatters): Check[] {
  const m = input.materials ?? {};
  const obj = input.object ?? {};
  const checks: Check[] = [];
  const fig = g.figures;
  const floatSides = SIDES.filter((s) => g.modes[s] === "float");
  const heldSides = SIDES.filter((s) => !floatSides.includes(s));

  // 1. Overlap
  const short = heldSides.filter((s) => g.overlap[s] < g.minOverlapMm - 1e-9);
  checks.push({
    id: "overlap-minimum",
    rule: "Every overlapped side covers the sheet by at least the studio minimum",
    verdict: short.length ? "fail" : "pass",
    reason: short.length
      ? `The window covers ${list(short.map((s) => `${f.shown(Math.max(0, fig.overlap[s]))} on the ${SIDE_WORD[s]}`))}; each overlapped side needs at least ${f.minimum()}.`
      : heldSides.length
        ? `Each overlapped side (${list(heldSides.map((s) => SIDE_WORD[s]))}) covers the sheet by at least ${f.minimum()}.`
        : "The sheet floats on every side; no side is held by the window.",
    source: SOURCES.overlap,
  });

  // 2. The object never touches the glazing
  const friable = isFriable(obj);
  checks.push({
    id: "glazing-separation",
    rule: "The object never touches the glazing",
    verdict: "pass",
    reason:
      g.spacerDepth > 0
        ? `The window board and a ${f.length(g.spacerDepth)} spacer keep the glazing off the object.`
        : `The window board (${g.topWindow ? "two boards, double mount" : "one board"}) keeps the glazing off the object.`,
    source: SOURCES.nedcc,
  });

  // 3. Archival boards, nothing harmful near the object
  const bad = [...(m.present ?? [])];
  if (m.attachment === "pressure-sensitive-tape" && !bad.includes("pressure-sensitive-tape")) bad.push("pressure-sensitive-tape");
  let v3: Verdict;
  let r3: string;
  if (bad.length) {
    v3 = "fail";
    r3 = `Remove ${list(bad.map((b) => b.replace(/-/g, " ")))}: none of it belongs on or near the object.`;
  } else if (m.boardGrade === "other") {
    v3 = "fail";
    r3 = "The board is not museum or conservation grade; boards that touch the object must be lignin-free museum (cotton) or conservation (purified pulp) board.";
  } else if (m.boardGrade) {
    v3 = "pass";
    r3 = `${m.boardGrade === "museum" ? "Museum (cotton)" : "Conservation (purified pulp)"} board, lignin-free, touches the object.`;
  } else {
    v3 = "warn";
    r3 = "Board grade not chosen yet: boards that touch the object must be museum or conservation grade.";
  }
  checks.push({
    id: "archival-boards",
    rule: "Boards touching the object are museum or conservation grade; no foam board, kraft paper or pressure-sensitive tape",
    verdict: v3,
    reason: r3,
    source: SOURCES.nedcc,
  });

  // 4. Photographs
  if (obj.objectType === "photograph") {
    let v: Verdict = "pass";
    const notes: string[] = [];
    if (m.patPassed === false) {
      v = "fail";
      notes.push("the board has not passed the Photographic Activity Test");
    } else if (m.patPassed === undefined) {
      v = "warn";
      notes.push("record whether the board has passed the Photographic Activity Test");
    }
    if (obj.photoProcess === "cyanotype" && m.buffered) {
      v = "fail";
      notes.push("a cyanotype needs unbuffered board: alkaline buffer can fade it");
    } else if (obj.photoProcess && SENSITIVE_PROCESSES.includes(obj.photoProcess) && m.buffered) {
      v = worstVerdict([v, "warn"]);
      notes.push("unbuffered board is often chosen for this process");
    } else if (m.buffered === undefined && obj.photoProcess === "cyanotype") {
      v = worstVerdict([v, "warn"]);
      notes.push("choose unbuffered board for a cyanotype");
    }
    const said = notes.join("; ");
    checks.push({
      id: "photo-board",
      rule: "Photographs: board has passed the PAT; unbuffered board for sensitive processes",
      verdict: v,
      reason: notes.length ? `${said.charAt(0).toUpperCase()}${said.slice(1)}.` : "The board has passed the Photographic Activity Test and suits the process.",
      source: SOURCES.photo,
    });
  } else {
    const reason = obj.objectType ? "Not a photograph: this rule does not apply." : "No object type given: this rule applies only if the object is a photograph.";
    checks.push({ id: "photo-board", rule: "Photographs: board has passed the PAT; unbuffered board for sensitive processes", verdict: "pass", reason, source: SOURCES.photo });
  }

  // 5. Friable media: glass, not acrylic, and room to spare
  if (friable) {
    let v: Verdict = "pass";
    let r = "Friable media under glass, with the window keeping it clear.";
    if (g.glazing.material === "acrylic") {
      v = "fail";
      r = "Friable media (pastel, charcoal, chalk) must not go under acrylic: its static charge can lift the media. Use glass.";
    } else if (!g.glazing.material) {
      v = "warn";
      r = "Glazing not chosen yet: friable media needs glass, not acrylic.";
    } else if (g.spacerDepth <= 0 && !g.topWindow) {
      v = "warn";
      r = "Under glass, good; give friable media deeper spacing (a spacer or a double mount) so loose particles fall clear of the glazing.";
    }
    checks.push({ id: "friable-glazing", rule: "Friable media: glass rather than acrylic, with deeper spacing", verdict: v, reason: r, source: SOURCES.friable });
  } else {
    checks.push({
      id: "friable-glazing",
      rule: "Friable media: glass rather than acrylic, with deeper spacing",
      verdict: "pass",
      reason: "No friable media recorded: this rule does not apply.",
      source: SOURCES.friable,
    });
  }

  // 6. Reversible attachment
  let v6: Verdict;
  let r6: string;
  if (!m.attachment) {
    v6 = "warn";
    r6 = "Attachment not chosen yet.";
  } else if (m.attachment === "pressure-sensitive-tape" || m.adhesive === "pressure-sensitive") {
    v6 = "fail";
    r6 = "Pressure-sensitive tape cannot be removed safely; use Japanese tissue hinges with starch paste or methyl cellulose, or corners.";
  } else if (HINGES.includes(m.attachment)) {
    if (!m.adhesive) {
      v6 = "warn";
      r6 = "Hinges chosen; record the adhesive (wheat or rice starch paste, or methyl cellulose).";
    } else if (["wheat-starch-paste", "rice-starch-paste", "methyl-cellulose"].includes(m.adhesive)) {
      v6 = "pass";
      r6 = `Hinges of ${m.tissue ? m.tissue : "Japanese tissue"} with ${m.adhesive.replace(/-/g, " ")}: reversible, and weaker than the object so a hinge tears first. Keep the paste on the object to a narrow strip (about 1/8 in).`;
    } else {
      v6 = "fail";
      r6 = "The hinge adhesive is not a reversible one; use wheat or rice starch paste, or methyl cellulose.";
    }
  } else {
    v6 = "pass";
    r6 = "Corners, strips or a sink mount hold the object without adhesive on it.";
  }
  checks.push({ id: "reversible-attachment", rule: "Attachment is reversible and weaker than the object", verdict: v6, reason: r6, source: SOURCES.loc });

  // 7. Hinge placement and kind: what matters is the edges the hinges sit on (the top, for a hanging work).
  let v7: Verdict = "pass";
  const r7: string[] = [];
  const edges = hingeEdges(input);
  const floatingHingeEdges = edges.filter((s) => floatSides.includes(s));
  if (!m.attachment) {
    v7 = "warn";
    r7.push("Attachment not chosen yet.");
  } else if (HINGES.includes(m.attachment)) {
    if (m.attachment === "t-hinge" && floatingHingeEdges.length) {
      v7 = "fail";
      r7.push(
        `The sheet floats on the ${list(floatingHingeEdges.map((s) => SIDE_WORD[s]))}, where the T-hinges sit: the window does not cover them there. Use V-hinges or pass-through hinges for a float.`,
      );
    } else if (m.attachment === "pendant-hinge" && floatingHingeEdges.length) {
      v7 = "warn";
      r7.push(
        `The sheet floats on the ${list(floatingHingeEdges.map((s) => SIDE_WORD[s]))}: pendant hinges would show above the sheet. V-hinges (folded) or pass-through hinges hide behind it.`,
      );
    }
    if (m.hingeEdge && m.hingeEdge !== "top") {
      v7 = worstVerdict([v7, "warn"]);
      r7.push("A hanging work is hinged along the top edge only, so the sheet can move with humidity.");
    }
    const want = hingesWanted(g.sheet, obj.paperWeightGsm);
    if (m.hingeCount !== undefined && m.hingeCount < want.count) {
      v7 = worstVerdict([v7, "warn"]);
      const why =
        want.byWeight > want.byWidth && want.grams !== null
          ? `a sheet of about ${Math.round(want.grams)} g (${obj.paperWeightGsm} g/m²) wants ${want.count} or more, at most ${HINGE_GRAMS_PER_HINGE} g a hinge`
          : `a sheet ${f.shown(fig.sheet.width)} wide wants ${want.count} or more spread along the top (two up to ${f.length(2 * HINGE_EDGE_MM_PER_HINGE)}, one more for each further ${f.length(HINGE_EDGE_MM_PER_HINGE)})`;
      r7.push(`${m.hingeCount} hinge${m.hingeCount === 1 ? "" : "s"}: ${why}.`);
    }
    if (!r7.length) {
      r7.push(
        m.attachment === "t-hinge"
          ? "T-hinges along the top edge, where the window covers the sheet and hides them."
          : floatingHingeEdges.length
            ? "Float hinges suit the floated edge, along the top."
            : "Hinges along the top edge.",
      );
    }
  } else if (floatSides.length && !FLOAT_METHODS.includes(m.attachment)) {
    v7 = "warn";
    r7.push(
      `The sheet floats on the ${list(floatSides.map((s) => SIDE_WORD[s]))}; ${m.attachment.replace(/-/g, " ")} may show. Edge strips, V-hinges or pass-through hinges suit a float.`,
    );
  } else {
    r7.push("No hinges: the object is held without adhesive.");
  }
  checks.push({
    id: "hinge-placement",
    rule: "Hinges on the top edge; T-hinges where the window covers that edge, float hinges where it floats; more hinges as size and weight grow",
    verdict: v7,
    reason: r7.join(" "),
    source: SOURCES.hinges,
  });

  // 8. UV-filtering glazing for every object the light guidance treats as very sensitive (shared/domain/light.ts).
  const light = lightClass(obj);
  let v8: Verdict = "pass";
  let r8: string;
  if (!light.verySensitive) r8 = "Not among the very light-sensitive objects: UV-filtering glazing is still a good choice.";
  else if (!g.glazing.material) {
    v8 = "warn";
    r8 = `Glazing not chosen yet: this object is very sensitive to light (${light.why}) and needs UV-filtering glazing.`;
  } else if (!g.glazing.uvFiltering) {
    v8 = "fail";
    r8 = `This object is very sensitive to light (${light.why}): use UV-filtering glass or acrylic.`;
  } else r8 = `UV-filtering glazing protects this very light-sensitive object (${light.why}); keep display light at ${light.maxLux} lux or less and time on display limited.`;
  checks.push({ id: "uv-glazing", rule: "UV-filtering glazing for light-sensitive objects", verdict: v8, reason: r8, source: SOURCES.light });

  return checks;
}
