/**
 * Light sensitivity of a work on paper or a photograph, from its catalogue (docs/trade.md §7).
 *
 * Display limits: very sensitive objects at most 50 lux (NISO Z39.79, as summarised by NEDCC
 * Preservation 101). Yearly exposure by responsivity category (CIE 157:2004 as widely quoted;
 * figures from memory, verify): high 15,000 lux·h a year, medium 150,000 lux·h a year, both at
 * 50 lux; low 600,000 lux·h a year at 200 lux. An unflagged work on paper is treated as very
 * sensitive, the cautious default. Guidance, never a guarantee.
 */
export type LightCatalogue = { objectType?: string | null; photoProcess?: string | null; sensitivities?: readonly string[] | null };
export type LightCategory = "high" | "medium" | "low";

export type LightClass = {
  category: LightCategory;
  /** NISO's "very sensitive" (at most 50 lux); every category here except low. */
  verySensitive: boolean;
  maxLux: number;
  luxHoursPerYear: number;
  /** Why the object falls in this category, in the framer's words. */
  why: string;
};

export const LIGHT_LIMITS: Record<LightCategory, { maxLux: number; luxHoursPerYear: number }> = {
  high: { maxLux: 50, luxHoursPerYear: 15_000 },
  medium: { maxLux: 50, luxHoursPerYear: 150_000 },
  low: { maxLux: 200, luxHoursPerYear: 600_000 },
};

const COLOUR_PROCESSES = ["chromogenic", "dye-transfer", "pigment-inkjet"];
const NINETEENTH_CENTURY_PROCESSES = ["albumen", "salted-paper", "cyanotype", "platinum-palladium", "collodion"];

function make(category: LightCategory, why: string): LightClass {
  return { category, verySensitive: category !== "low", ...LIGHT_LIMITS[category], why };
}

/** The object's light category. Every object Reversa keeps is a work on paper or a photograph, so none falls below medium. */
export function lightClass(o: LightCatalogue): LightClass {
  const sens = o.sensitivities ?? [];
  if (sens.includes("light-sensitive")) return make("high", "it is recorded as light-sensitive");
  if (o.objectType === "watercolour") return make("high", "watercolours often hold fugitive colour");
  if (o.objectType === "pastel") return make("high", "pastels may hold fugitive colour");
  if (o.objectType === "photograph") {
    if (o.photoProcess === "gelatin-silver") return make("medium", "it is a black-and-white silver print");
    if (o.photoProcess && COLOUR_PROCESSES.includes(o.photoProcess)) return make("high", "it is a colour photograph");
    if (o.photoProcess && NINETEENTH_CENTURY_PROCESSES.includes(o.photoProcess)) return make("high", "it is a 19th-century photographic process");
    return make("high", "the photographic process is not recorded, so the cautious category is used");
  }
  return make("medium", "works on paper are treated as very sensitive unless recorded otherwise");
}

const thousands = (n: number) => n.toLocaleString("en-GB");

/** Light and display guidance for the object, in full sentences. */
export function lightGuidance(o: LightCatalogue): string {
  const c = lightClass(o);
  const lines = [
    c.verySensitive
      ? `Very sensitive to light (${c.why}): display at ${c.maxLux} lux or less, for no more than 12 weeks at a time and 52 weeks in all, then rest it in the dark.`
      : `Moderately sensitive to light: display at ${c.maxLux} lux or less and limit the time on display.`,
    `A yearly exposure of about ${thousands(c.luxHoursPerYear)} lux·hours suits its category (${c.category} responsivity, CIE 157:2004 as quoted).`,
    "Frame it behind UV-filtering glazing; UV from the light source at most 75 µW/lm; keep relative humidity at 35–50 % (± 5 %).",
    "This is guidance from published standards, not a guarantee; a conservator can advise on a particular object.",
  ];
  return lines.join(" ");
}
