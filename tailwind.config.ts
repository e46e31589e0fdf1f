import type { Config } from "tailwindcss";

const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}", "./editor/**/*.{ts,tsx}"],
  theme: {
    extend: {
      fontFamily: { sans: ["var(--font-inter)", "system-ui", "sans-serif"] },
      colors: {
        // Our own palette: slate-blue ink, warm paper, and three finding tones.
        ink: { DEFAULT: "#1f2a37", soft: "#4b5563" },
        paper: "#f7f5f0",
        hazard: "#b42318",
        caution: "#b54708",
        advisory: "#2e5aac",
        ok: "#1b7a4b",
      },
    },
  },
};
export default config;
