import { StyleSheet } from "@react-pdf/renderer";

/** The app's paper-and-ink tokens (tailwind.config.ts), for documents. */
export const INK = "#1d1c1a";
export const GRAPHITE = "#5c5a56";
export const STONE = "#dcd5c8";
export const PAPER = "#fbf8f2";
export const ACCENT = "#1f5c57";
export const PASS = "#2e6a3c";
export const WARN = "#7f5300";
export const FAIL = "#9a2b2b";

export const s = StyleSheet.create({
  page: { fontFamily: "Libre Franklin", fontSize: 9, color: INK, paddingTop: 86, paddingBottom: 54, paddingHorizontal: 40 },
  header: {
    position: "absolute",
    top: 24,
    left: 40,
    right: 40,
    flexDirection: "row",
    justifyContent: "space-between",
    alignItems: "flex-start",
    borderBottomWidth: 1,
    borderBottomColor: ACCENT,
    paddingBottom: 8,
  },
  studio: { fontSize: 11, fontWeight: 700 },
  small: { fontSize: 7.5, color: GRAPHITE },
  kind: { fontSize: 13, fontWeight: 700, color: ACCENT, textAlign: "right" },
  footer: { position: "absolute", bottom: 22, left: 40, right: 40, fontSize: 7.5, color: GRAPHITE, borderTopWidth: 0.5, borderTopColor: STONE, paddingTop: 6 },
  h1: { fontSize: 15, fontWeight: 700, marginBottom: 2 },
  h2: { fontSize: 10.5, fontWeight: 700, marginTop: 12, marginBottom: 4, color: ACCENT },
  row: { flexDirection: "row", borderBottomWidth: 0.5, borderBottomColor: STONE, paddingVertical: 2.5 },
  label: { width: 130, color: GRAPHITE },
  value: { flex: 1 },
  p: { marginBottom: 4 },
  caution: { borderWidth: 0.75, borderColor: WARN, backgroundColor: "#f7ecd6", padding: 6, marginVertical: 4, color: INK },
});
