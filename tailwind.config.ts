import type { Config } from "tailwindcss";

// Reversa's paper-and-ink palette. Every colour used by the app is a token here;
// contrast pairs are checked against WCAG 2.2 AA (see DEVELOPERS.md, "The look").
export default {
  content: ["./index.html", "./src/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: "#f7f4ee", deep: "#efe9df", sheet: "#fbf8f2" },
        ink: { DEFAULT: "#1d1c1a", soft: "#3a3835" },
        graphite: { DEFAULT: "#5c5a56", light: "#8a877f" },
        stone: { DEFAULT: "#dcd5c8", light: "#e9e3d8" },
        accent: { DEFAULT: "#1f5c57", hover: "#174844", soft: "#e3efed" },
        pass: { DEFAULT: "#2e6a3c", soft: "#e4f0e4" },
        warn: { DEFAULT: "#7f5300", soft: "#f7ecd6" },
        fail: { DEFAULT: "#9a2b2b", soft: "#f6e1df" },
      },
      fontFamily: {
        sans: ['"Libre Franklin"', "system-ui", "sans-serif"],
      },
      borderRadius: { card: "6px" },
      boxShadow: { card: "0 1px 2px rgba(29,28,26,0.06), 0 0 0 1px rgba(29,28,26,0.05)" },
    },
  },
} satisfies Config;
