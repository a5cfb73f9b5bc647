import type { Config } from "tailwindcss";

// Keelson's own palette: "ink" neutrals with a blue-grey cast, "tide" for actions and focus,
// "brass" for the accent. Work-order states get their own set with the due engine.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./server/**/*.{ts,tsx}"],
  darkMode: "class",
  theme: {
    extend: {
      colors: {
        ink: {
          50: "#f5f7f9",
          100: "#e9edf1",
          200: "#d3dae2",
          300: "#b0bcc8",
          400: "#8796a7",
          // Secondary text's grey: one value per theme (app/globals.css, --ink-500), each 4.5:1 or more
          // on that theme's page, panels and hover rows (WCAG 2.2 SC 1.4.3), so `text-ink-500` needs no
          // dark partner.
          500: "var(--ink-500)",
          600: "#4f5f71",
          700: "#3e4b5a",
          800: "#2a3440",
          850: "#1f2832",
          900: "#161d25",
          950: "#0d1218",
        },
        tide: {
          50: "#eef8fa",
          100: "#d3eef2",
          200: "#a8dce5",
          300: "#6fc1cf",
          400: "#3ea3b5",
          // ink-950 text on it (the night theme's primary button) at 4.7:1, WCAG 2.2 SC 1.4.3.
          500: "#258b9e",
          600: "#1a6c7d",
          700: "#175766",
          800: "#164854",
          900: "#143c47",
        },
        brass: {
          100: "#f8edd3",
          300: "#e8c274",
          400: "#dcaa4a",
          500: "#c48d2e",
          600: "#a37022",
          700: "#80561e",
        },
        alarm: { 50: "#fdf0ef", 100: "#fadcd9", 500: "#c8412f", 600: "#a93424", 700: "#8a2b1f", 300: "#ef9d91" },
        go: { 50: "#eef8f1", 100: "#d5efdd", 500: "#2f8a4f", 600: "#24703f", 700: "#1f5a35", 300: "#86cc9c" },
      },
      fontFamily: {
        sans: ["var(--font-inter)", "ui-sans-serif", "system-ui", "sans-serif"],
        mono: ["ui-monospace", "SFMono-Regular", "Menlo", "monospace"],
      },
    },
  },
};

export default config;
