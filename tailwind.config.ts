import type { Config } from "tailwindcss";

/** Vicinal's design language: warm paper, ink, a deep pine for action and amber for attention. */
export default {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: "#f6f4ef", raised: "#fffdf8", sunk: "#ece8df" },
        ink: { DEFAULT: "#1d2433", soft: "#4a5263", faint: "#6b7282" },
        line: { DEFAULT: "#d9d3c7", strong: "#b9b1a2" },
        pine: { 50: "#e9f2f0", 100: "#cfe3df", 500: "#2b7a73", 600: "#1f5f5b", 700: "#17494a", 900: "#0e2e2f" },
        amber: { 50: "#fbf3e2", 100: "#f5e2b8", 500: "#d9a441", 700: "#8a6216" },
        alarm: { 50: "#fbeae6", 500: "#b4442f", 700: "#8a2f1f" },
      },
      fontFamily: {
        sans: ["var(--font-manrope)", "system-ui", "sans-serif"],
        mono: ["var(--font-jetbrains)", "ui-monospace", "monospace"],
      },
      borderRadius: { card: "10px" },
      boxShadow: { card: "0 1px 0 rgba(29,36,51,0.04), 0 1px 3px rgba(29,36,51,0.06)" },
    },
  },
} satisfies Config;
