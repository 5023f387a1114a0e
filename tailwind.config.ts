import type { Config } from "tailwindcss";

/** One accent (a deep teal), quiet greys, tabular figures for numbers. */
export default {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        accent: {
          50: "#eef8f7",
          100: "#d5eeeb",
          200: "#aadcd6",
          500: "#1d8a80",
          600: "#136f67",
          700: "#115a54",
          800: "#0f4744",
        },
        ink: { DEFAULT: "#1c2430", soft: "#4a5565", faint: "#8a94a3" },
        line: "#dde2e8",
        paper: "#f7f8fa",
      },
      fontFamily: {
        sans: ["var(--font-sans)", "system-ui", "sans-serif"],
        mono: ["var(--font-mono)", "ui-monospace", "monospace"],
      },
    },
  },
} satisfies Config;
