import type { Config } from "tailwindcss";

// Ink-and-paper neutrals, one warm accent for actions, red only for errors and hazards.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: "#1d1f21", soft: "#3b3f44", muted: "#5d636a" },
        paper: { DEFAULT: "#fbfaf7", raised: "#ffffff", sunk: "#f1efe9", line: "#d9d5cc" },
        accent: { DEFAULT: "#b4530d", strong: "#8f3f07", soft: "#fbeee2" },
        hazard: { DEFAULT: "#b42318", soft: "#fdecea" },
        ok: { DEFAULT: "#1f6f43", soft: "#e6f4ec" },
      },
      fontFamily: {
        mono: ["'JetBrains Mono'", "ui-monospace", "monospace"],
        sans: ["system-ui", "-apple-system", "Segoe UI", "Roboto", "sans-serif"],
      },
    },
  },
  plugins: [],
};

export default config;
