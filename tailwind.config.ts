import type { Config } from "tailwindcss";

/**
 * Bandwright's look: a light, calm theme with one accent ("petrol", a deep blue-green of our own) and
 * cool neutrals. Band colours for charts live in components/charts/palette.ts, not here, so that the
 * accent never competes with data.
 */
const config: Config = {
  theme: {
    extend: {
      colors: {
        accent: {
          50: "#eef6f8",
          100: "#d6eaef",
          200: "#add3de",
          300: "#7fb6c7",
          500: "#2e7890",
          600: "#23657b",
          700: "#1c5264",
          800: "#174352",
        },
        ink: {
          DEFAULT: "#1b2329",
          muted: "#4d5a63",
          faint: "#626e77",
        },
        surface: {
          DEFAULT: "#ffffff",
          sunken: "#f4f6f7",
          raised: "#fbfcfc",
        },
        line: {
          DEFAULT: "#d9dee1",
          strong: "#b9c1c6",
        },
        danger: { 50: "#fcf1f0", 600: "#b3261e", 700: "#8f1f19" },
        caution: { 50: "#fdf6e7", 600: "#8a5a00", 700: "#6e4800" },
        success: { 50: "#eef7f0", 600: "#2f6f3e", 700: "#255a32" },
      },
      fontFamily: {
        sans: ["var(--font-inter)", "var(--font-inter-greek)", "system-ui", "sans-serif"],
        mono: ["var(--font-geist-mono)", "ui-monospace", "monospace"],
      },
      fontSize: {
        // A dense scale: 13 px body copy reads well in tables full of numbers.
        xs: ["0.75rem", { lineHeight: "1rem" }],
        sm: ["0.8125rem", { lineHeight: "1.25rem" }],
        base: ["0.875rem", { lineHeight: "1.375rem" }],
      },
      maxWidth: { page: "72rem" },
    },
  },
};

export default config;
