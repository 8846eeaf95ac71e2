import type { Config } from "tailwindcss";
import { PALETTE } from "./shared/drawing/palette.ts";

// Reversa's paper-and-ink palette. Every colour used by the app is a token here;
// contrast pairs are checked against WCAG 2.2 AA (see DEVELOPERS.md, "The look").
export default {
  content: ["./index.html", "./src/**/*.{ts,tsx}"],
  theme: {
    extend: {
      // One palette for screen and PDF (shared/drawing/palette.ts).
      colors: PALETTE,
      fontFamily: {
        sans: ['"Libre Franklin"', "system-ui", "sans-serif"],
      },
      borderRadius: { card: "6px" },
      boxShadow: { card: "0 1px 2px rgba(29,28,26,0.06), 0 0 0 1px rgba(29,28,26,0.05)" },
    },
  },
} satisfies Config;
