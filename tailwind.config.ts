import type { Config } from "tailwindcss";

/**
 * Loxodrome's palette: "lox" is a deep sea-glass teal (chart ink at sea), "brass" the warm
 * accent of an old binnacle, "chart" the neutral paper and ink. Status colours are our own
 * muted set ("steady", "heed", "halt") and always come with a word and a shape, never colour alone.
 */
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}", "./lib/**/*.{ts,tsx}"],
  darkMode: "media",
  theme: {
    extend: {
      colors: {
        lox: {
          50: "#eef7f6",
          100: "#d5ebe8",
          200: "#acd6d1",
          300: "#7bbab4",
          400: "#4e9a95",
          500: "#327e7a",
          600: "#1d5c63",
          700: "#184b52",
          800: "#163d43",
          900: "#122f34",
          950: "#0a1c20",
        },
        brass: {
          100: "#f6ead6",
          200: "#ecd2a6",
          300: "#dfb26c",
          400: "#d2974a",
          500: "#c27c2c",
          600: "#a36221",
          700: "#804b1d",
        },
        chart: {
          paper: "rgb(var(--chart-paper) / <alpha-value>)",
          sheet: "rgb(var(--chart-sheet) / <alpha-value>)",
          ink: "rgb(var(--chart-ink) / <alpha-value>)",
          muted: "rgb(var(--chart-muted) / <alpha-value>)",
          rule: "rgb(var(--chart-rule) / <alpha-value>)",
        },
        // "ink" shades keep small status words at 4.5:1 on their soft backgrounds (WCAG 2 AA).
        steady: { DEFAULT: "#2f7d4f", ink: "#266640", soft: "rgb(var(--steady-soft) / <alpha-value>)" },
        heed: { DEFAULT: "#b26a00", ink: "#8a5200", soft: "rgb(var(--heed-soft) / <alpha-value>)" },
        halt: { DEFAULT: "#b3261e", soft: "rgb(var(--halt-soft) / <alpha-value>)" },
      },
      fontFamily: {
        sans: ["var(--font-body)", "system-ui", "sans-serif"],
        display: ["var(--font-display)", "var(--font-body)", "sans-serif"],
        mono: ["var(--font-mono)", "ui-monospace", "monospace"],
      },
      borderRadius: { card: "0.875rem" },
      boxShadow: { card: "0 1px 0 rgb(0 0 0 / 0.04), 0 8px 24px -12px rgb(0 0 0 / 0.18)" },
    },
  },
  plugins: [],
};

export default config;
