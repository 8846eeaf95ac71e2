import { sql } from "drizzle-orm";
import type { Db } from "./client.ts";
import { user } from "./schema.ts";
import { makeClient, makeObject, makeUser } from "./factories.ts";
import { saveSettings } from "../features/settings/settings.repo.ts";
import type { ObjectCreateInput } from "../../shared/schemas/objects.ts";
import type { SessionUser } from "../../shared/schemas/auth.ts";
import { appendEvent } from "../features/history/history.chain.ts";
import { seedMountings } from "./seed-mountings.ts";
import { seedCustody } from "./seed-custody.ts";
import { seedCondition } from "./seed-condition.ts";

/** The invented demo studio. Every name here is made up for the demo. */
export const DEMO_PASSWORD = "reversa-demo";
export const DEMO_USERS = [
  { email: "admin@reversa.test", name: "Maren Quist", role: "admin" },
  { email: "framer@reversa.test", name: "Jonah Pell", role: "framer" },
  { email: "registrar@reversa.test", name: "Tomasz Eberlin", role: "registrar", client: "wrenfold" },
  { email: "collector@reversa.test", name: "Odile Varga-Pennick", role: "collector", client: "varga" },
] as const;

type DemoObject = Omit<ObjectCreateInput, "clientId" | "objectNumber"> & { owner: "varga" | "wrenfold" | "aalto" | "saltmarsh" };

const IN = 25.4;
const OBJECTS: DemoObject[] = [
  { owner: "varga", title: "Estuary at low water, study", maker: "Ilse Korrow", dateMade: "c. 1962", objectType: "watercolour", medium: "Watercolour over graphite", support: "Wove paper, 300 g/m²", sheetWidthMm: 380, sheetHeightMm: 280, borderLeftMm: 18, borderTopMm: 16, borderRightMm: 18, borderBottomMm: 22, sensitivities: ["light-sensitive"], status: "in-studio", location: "Plan chest B, drawer 2", valuationMinor: 420000, valuationCurrency: "GBP", valuationDate: "2025-09-14", valuationBasis: "market", valuer: "Harl & Osten Valuers (invented)" },
  { owner: "varga", title: "Three pears on a blue cloth", maker: "Amadou Fenn", dateMade: "1988", objectType: "pastel", medium: "Soft pastel", support: "Sanded pastel paper", sheetWidthMm: 500, sheetHeightMm: 650, sensitivities: ["friable-media", "light-sensitive"], status: "in-studio", location: "Bench 1", valuationMinor: 1250000, valuationCurrency: "GBP", valuationDate: "2026-02-03", valuationBasis: "replacement" },
  { owner: "varga", title: "Harbour wall, morning", maker: "Ilse Korrow", dateMade: "1964", objectType: "print", medium: "Etching and aquatint", support: "Laid paper", edition: "12/40", inscriptions: "Signed and numbered in pencil, lower margin", sheetWidthMm: 330, sheetHeightMm: 420, borderLeftMm: 52, borderTopMm: 48, borderRightMm: 52, borderBottomMm: 70, status: "with-owner", location: "Owner's home, hall", valuationMinor: 180000, valuationCurrency: "GBP", valuationDate: "2024-11-20", valuationBasis: "market" },
  { owner: "varga", title: "Portrait of a neighbour", maker: "Unrecorded photographer", dateMade: "c. 1895", objectType: "photograph", photoProcess: "albumen", medium: "Albumen print on card mount", support: "Thin albumen paper on card", sheetWidthMm: 108, sheetHeightMm: 165, sensitivities: ["light-sensitive", "fragile"], status: "in-studio", location: "Photo cabinet, box 4", valuationMinor: 65000, valuationCurrency: "GBP", valuationDate: "2026-01-10", valuationBasis: "market" },
  { owner: "varga", title: "Garden gate in snow", maker: "Petra Lindqvist-Oyelaran", dateMade: "2011", objectType: "photograph", photoProcess: "gelatin-silver", medium: "Gelatin silver print, fibre-based", sheetWidthMm: 8 * IN, sheetHeightMm: 10 * IN, borderLeftMm: 12.7, borderTopMm: 12.7, borderRightMm: 12.7, borderBottomMm: 19, status: "with-owner", valuationMinor: 240000, valuationCurrency: "GBP", valuationDate: "2025-05-02", valuationBasis: "market" },
  { owner: "varga", title: "Blue fern", maker: "Petra Lindqvist-Oyelaran", dateMade: "2019", objectType: "photograph", photoProcess: "cyanotype", medium: "Cyanotype", support: "Cotton rag paper", sheetWidthMm: 280, sheetHeightMm: 356, sensitivities: ["light-sensitive"], status: "in-studio", location: "Bench 2", valuationMinor: 90000, valuationCurrency: "GBP", valuationDate: "2026-03-18", valuationBasis: "market" },
  { owner: "varga", title: "Letter to a sister, two leaves", maker: "Unknown hand", dateMade: "1843", objectType: "document", medium: "Iron gall ink", support: "Laid writing paper", sheetWidthMm: 186, sheetHeightMm: 230, sensitivities: ["fragile"], thicknessNotes: "Old fold lines; slight cockling at the lower right.", status: "with-owner", valuationMinor: 30000, valuationCurrency: "GBP", valuationDate: "2023-06-30", valuationBasis: "agreed" },
  { owner: "varga", title: "Heron, ink study", maker: "Hollis Dray", dateMade: "1977", objectType: "drawing", medium: "Brush and ink", support: "Japanese paper", sheetWidthMm: 297, sheetHeightMm: 420, status: "on-loan", location: "Lent to a regional exhibition", valuationMinor: 150000, valuationCurrency: "GBP", valuationDate: "2025-12-01", valuationBasis: "market" },
  { owner: "wrenfold", title: "Survey of the east meadow", maker: "Anselm Toller", dateMade: "1791", objectType: "drawing", medium: "Pen and ink with wash", support: "Laid paper, watermarked", sheetWidthMm: 594, sheetHeightMm: 420, sensitivities: ["light-sensitive", "fragile"], status: "in-studio", location: "Large plan chest, drawer 1", valuationMinor: 2800000, valuationCurrency: "GBP", valuationDate: "2026-04-12", valuationBasis: "replacement", valuer: "Institution's own valuation" },
  { owner: "wrenfold", title: "The house from the lake", maker: "Anselm Toller", dateMade: "1793", objectType: "watercolour", medium: "Watercolour", support: "Wove paper", sheetWidthMm: 560, sheetHeightMm: 760, borderLeftMm: 25, borderTopMm: 25, borderRightMm: 25, borderBottomMm: 25, sensitivities: ["light-sensitive"], status: "in-studio", location: "Bench 3", valuationMinor: 4500000, valuationCurrency: "GBP", valuationDate: "2026-04-12", valuationBasis: "replacement" },
  { owner: "wrenfold", title: "Estate map, sheet 3", maker: "Office of the estate surveyor", dateMade: "1802", objectType: "document", medium: "Ink and watercolour", support: "Paper lined with linen", sheetWidthMm: 841, sheetHeightMm: 594, sensitivities: ["fragile"], status: "with-owner", location: "Map room", valuationMinor: 900000, valuationCurrency: "GBP", valuationDate: "2025-10-01", valuationBasis: "replacement" },
  { owner: "wrenfold", title: "Gardeners at rest", maker: "Unrecorded photographer", dateMade: "c. 1910", objectType: "photograph", photoProcess: "gelatin-silver", medium: "Gelatin silver print", sheetWidthMm: 165, sheetHeightMm: 120, status: "with-owner", location: "Archive store, box 17", valuationMinor: 40000, valuationCurrency: "GBP", valuationDate: "2025-10-01", valuationBasis: "replacement" },
  { owner: "wrenfold", title: "Lady of the house, seated", maker: "Unrecorded photographer", dateMade: "c. 1858", objectType: "photograph", photoProcess: "salted-paper", medium: "Salted paper print", sheetWidthMm: 150, sheetHeightMm: 195, sensitivities: ["light-sensitive", "fragile"], status: "in-studio", location: "Photo cabinet, box 1", valuationMinor: 600000, valuationCurrency: "GBP", valuationDate: "2026-04-12", valuationBasis: "replacement" },
  { owner: "wrenfold", title: "Botanical plate: wild rose", maker: "Cordelia Vane", dateMade: "1820", objectType: "print", medium: "Hand-coloured engraving", support: "Wove paper", sheetWidthMm: 230, sheetHeightMm: 310, borderLeftMm: 30, borderTopMm: 28, borderRightMm: 30, borderBottomMm: 45, sensitivities: ["light-sensitive"], status: "with-owner", location: "Print room", valuationMinor: 120000, valuationCurrency: "GBP", valuationDate: "2025-10-01", valuationBasis: "replacement" },
  { owner: "wrenfold", title: "Botanical plate: hawthorn", maker: "Cordelia Vane", dateMade: "1820", objectType: "print", medium: "Hand-coloured engraving", support: "Wove paper", sheetWidthMm: 230, sheetHeightMm: 310, borderLeftMm: 30, borderTopMm: 28, borderRightMm: 30, borderBottomMm: 45, sensitivities: ["light-sensitive"], status: "with-owner", location: "Print room", valuationMinor: 120000, valuationCurrency: "GBP", valuationDate: "2025-10-01", valuationBasis: "replacement" },
  { owner: "wrenfold", title: "Sampler alphabet", maker: "Mary Ann Holbeck (aged 11)", dateMade: "1834", objectType: "textile-on-paper", medium: "Silk thread on perforated card", sheetWidthMm: 250, sheetHeightMm: 300, sensitivities: ["fragile", "light-sensitive"], status: "with-conservator", location: "With the textile conservator", valuationMinor: 220000, valuationCurrency: "GBP", valuationDate: "2025-10-01", valuationBasis: "replacement" },
  { owner: "wrenfold", title: "Chalk study of hands", maker: "Anselm Toller", dateMade: "c. 1790", objectType: "drawing", medium: "Red and white chalk", support: "Blue laid paper", sheetWidthMm: 270, sheetHeightMm: 360, sensitivities: ["friable-media", "light-sensitive"], status: "in-studio", location: "Bench 1", valuationMinor: 1600000, valuationCurrency: "GBP", valuationDate: "2026-04-12", valuationBasis: "replacement" },
  { owner: "wrenfold", title: "Orchard wall, colour study", maker: "Rosalind Ekwueme-Hart", dateMade: "1996", objectType: "photograph", photoProcess: "chromogenic", medium: "Chromogenic print", sheetWidthMm: 406, sheetHeightMm: 508, sensitivities: ["light-sensitive"], status: "on-loan", location: "Touring exhibition, venue 2", valuationMinor: 350000, valuationCurrency: "GBP", valuationDate: "2026-04-12", valuationBasis: "replacement" },
  { owner: "aalto", title: "Night tram", maker: "Jarno Heikkilä-Moss", dateMade: "2004", objectType: "print", medium: "Screenprint", edition: "AP 2/5", sheetWidthMm: 500, sheetHeightMm: 700, borderLeftMm: 40, borderTopMm: 40, borderRightMm: 40, borderBottomMm: 60, status: "in-studio", location: "Rack 2", valuationMinor: 210000, valuationCurrency: "EUR", valuationDate: "2026-06-01", valuationBasis: "market" },
  { owner: "aalto", title: "Birch bark, detail", maker: "Jarno Heikkilä-Moss", dateMade: "2015", objectType: "photograph", photoProcess: "pigment-inkjet", medium: "Pigment inkjet print", support: "Cotton rag, matte", sheetWidthMm: 432, sheetHeightMm: 559, borderLeftMm: 38, borderTopMm: 38, borderRightMm: 38, borderBottomMm: 38, status: "with-owner", valuationMinor: 150000, valuationCurrency: "EUR", valuationDate: "2026-06-01", valuationBasis: "market" },
  { owner: "aalto", title: "Lake in August", maker: "Unknown maker", dateMade: "20th century", objectType: "watercolour", medium: "Watercolour and gouache", sheetWidthMm: 240, sheetHeightMm: 175, status: "in-studio", location: "Bench 2", valuationMinor: 45000, valuationCurrency: "EUR", valuationDate: "2024-03-12", valuationBasis: "market" },
  { owner: "aalto", title: "Platinum study: pebbles", maker: "Odran Keyes", dateMade: "2008", objectType: "photograph", photoProcess: "platinum-palladium", medium: "Platinum/palladium print", sheetWidthMm: 279, sheetHeightMm: 356, borderLeftMm: 25, borderTopMm: 30, borderRightMm: 25, borderBottomMm: 30, status: "in-studio", location: "Photo cabinet, box 2", valuationMinor: 320000, valuationCurrency: "EUR", valuationDate: "2026-06-01", valuationBasis: "market" },
  { owner: "aalto", title: "Poster for a harbour festival", maker: "Studio Halden (invented)", dateMade: "1958", objectType: "print", medium: "Offset lithograph", sheetWidthMm: 620, sheetHeightMm: 880, sensitivities: ["light-sensitive", "fragile"], thicknessNotes: "Thin poster paper with old folds.", status: "in-studio", location: "Large plan chest, drawer 3", valuationMinor: 80000, valuationCurrency: "EUR", valuationDate: "2025-01-15", valuationBasis: "market" },
  { owner: "saltmarsh", title: "Parish boundary deed", maker: "Unknown clerk", dateMade: "1688", objectType: "document", medium: "Iron gall ink on parchment-like paper", sheetWidthMm: 380, sheetHeightMm: 290, sensitivities: ["fragile"], status: "in-studio", location: "Strongroom shelf 1", valuationMinor: 500000, valuationCurrency: "GBP", valuationDate: "2025-08-08", valuationBasis: "replacement" },
  { owner: "saltmarsh", title: "Lifeboat crew, 1921", maker: "Unrecorded photographer", dateMade: "1921", objectType: "photograph", photoProcess: "gelatin-silver", medium: "Gelatin silver print", sheetWidthMm: 254, sheetHeightMm: 203, status: "with-owner", location: "Reading room display", valuationMinor: 25000, valuationCurrency: "GBP", valuationDate: "2025-08-08", valuationBasis: "replacement" },
  { owner: "saltmarsh", title: "Tide table broadside", maker: "Printed for the harbour board", dateMade: "1874", objectType: "print", medium: "Letterpress", sheetWidthMm: 305, sheetHeightMm: 460, borderLeftMm: 20, borderTopMm: 20, borderRightMm: 20, borderBottomMm: 20, status: "in-studio", location: "Bench 3", valuationMinor: 15000, valuationCurrency: "GBP", valuationDate: "2025-08-08", valuationBasis: "replacement" },
  { owner: "saltmarsh", title: "Fishing fleet at anchor", maker: "Unrecorded photographer", dateMade: "c. 1870", objectType: "photograph", photoProcess: "collodion", medium: "Collodion positive", sheetWidthMm: 89, sheetHeightMm: 114, sensitivities: ["fragile"], status: "in-studio", location: "Photo cabinet, box 3", valuationMinor: 70000, valuationCurrency: "GBP", valuationDate: "2025-08-08", valuationBasis: "replacement" },
  { owner: "saltmarsh", title: "Dye transfer: red nets", maker: "Ruth Calloway-Ng", dateMade: "1983", objectType: "photograph", photoProcess: "dye-transfer", medium: "Dye transfer print", sheetWidthMm: 356, sheetHeightMm: 432, sensitivities: ["light-sensitive"], status: "with-owner", valuationMinor: 180000, valuationCurrency: "GBP", valuationDate: "2025-08-08", valuationBasis: "replacement" },
  { owner: "saltmarsh", title: "Charcoal sketch of the quay", maker: "Hollis Dray", dateMade: "1969", objectType: "drawing", medium: "Charcoal", support: "Cartridge paper", sheetWidthMm: 420, sheetHeightMm: 297, sensitivities: ["friable-media"], status: "in-studio", location: "Bench 1", valuationMinor: 60000, valuationCurrency: "GBP", valuationDate: "2025-08-08", valuationBasis: "replacement" },
  { owner: "saltmarsh", title: "Harbour board minutes, loose leaf", maker: "Clerk to the harbour board", dateMade: "1902", objectType: "document", medium: "Typescript with ink annotations", sheetWidthMm: 210, sheetHeightMm: 330, status: "with-owner", location: "Archive store", valuationMinor: 5000, valuationCurrency: "GBP", valuationDate: "2025-08-08", valuationBasis: "replacement" },
];

/** Seeds the demo studio into an empty database. Returns false when the database already has users. */
export async function seedDemo(db: Db): Promise<boolean> {
  const n = db.select({ n: sql<number>`count(*)` }).from(user).get()?.n ?? 0;
  if (n > 0) return false;

  saveSettings(db, {
    studioName: "Tidewell & Marr Conservation Framing",
    studioAddress: "Unit 4, Ropewalk Yard, Eastharbour (an invented demo studio)",
    studioContact: "01632 960 417 · bench@tidewell-marr.example",
    unit: "mm",
    vocabulary: "mount",
    paperSize: "A4",
    currency: "GBP",
    minOverlapMm: 5,
    rebateClearanceMm: 2,
    checkIntervalMonths: 24,
    checkIntervalOnLoanMonths: 12,
    framePresets: [
      { label: "Studio stock: 40 × 50 cm", widthMm: 400, heightMm: 500 },
      { label: "Studio stock: 50 × 70 cm", widthMm: 500, heightMm: 700 },
    ],
  });

  const clients = {
    varga: makeClient(db, { kind: "private", name: "Odile Varga-Pennick", contactName: "Odile Varga-Pennick", email: "collector@reversa.test", phone: "+44 20 7946 0001", address: "12 Quillmarsh Row, Eastharbour" }),
    wrenfold: makeClient(db, { kind: "institution", name: "Wrenfold Hall Collection Trust", contactName: "Tomasz Eberlin, Registrar", email: "registrar@reversa.test", phone: "+44 20 7946 0002", address: "Wrenfold Hall, Lakeside Lane" }),
    aalto: makeClient(db, { kind: "private", name: "Benedikt Aalto-Rhee", contactName: "Benedikt Aalto-Rhee", email: "benedikt@example.test", address: "Flat 3, 9 Chandler Street" }),
    saltmarsh: makeClient(db, { kind: "institution", name: "Saltmarsh Regional Archive", contactName: "Archive office", email: "archive@example.test", address: "The Old Customs House, Eastharbour" }),
  };

  const ids: Record<string, string> = {};
  for (const u of DEMO_USERS) {
    ids[u.role] = await makeUser(db, { email: u.email, name: u.name, role: u.role, clientId: "client" in u ? clients[u.client].id : null, password: DEMO_PASSWORD });
  }
  const framer: SessionUser = { id: ids.framer, name: "Jonah Pell", email: "framer@reversa.test", role: "framer", clientId: null };

  OBJECTS.forEach(({ owner, ...o }, i) => {
    const objectNumber = `2026-${String(i + 1).padStart(4, "0")}`;
    const id = makeObject(db, clients[owner].id, { ...o, objectNumber });
    appendEvent(db, { objectId: id, type: "created", actor: framer, summary: `Recorded as ${objectNumber}, “${o.title}”.`, data: { objectNumber } });
  });
  seedMountings(db, framer);
  seedCustody(db, framer);
  seedCondition(db, framer);
  return true;
}
