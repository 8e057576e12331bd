import type { Config } from "tailwindcss";

const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./lib/editor/**/*.{ts,tsx}"],
  darkMode: "class",
  theme: {
    extend: {
      fontFamily: {
        sans: ["var(--font-sans)", "system-ui", "sans-serif"],
        mono: ["var(--font-mono)", "ui-monospace", "monospace"],
      },
      colors: {
        // Ringside's own palette: slate paper, a deep teal ink and an amber signal.
        ink: { DEFAULT: "#0f3d3e", soft: "#2f6f6f" },
        paper: { DEFAULT: "#f6f5f1", deep: "#ebe8df" },
        signal: { DEFAULT: "#c77d14", soft: "#f1d19b" },
        night: { DEFAULT: "#121719", panel: "#1b2326", line: "#2b363a" },
      },
    },
  },
  plugins: [],
};

export default config;
