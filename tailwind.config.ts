import type { Config } from "tailwindcss";

/**
 * Rhomb's palette: warm paper, deep ink, a petrol accent; matrix signs use a blue / orange pair
 * that stays distinct for the common forms of colour blindness (and is never the only cue —
 * bars also point up or down).
 */
export default {
  content: ["./index.html", "./src/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: "#f7f5ef", raised: "#ffffff", sunk: "#ece8de" },
        ink: { DEFAULT: "#17212b", soft: "#3d4a57", faint: "#65717d" },
        petrol: { 50: "#e7f2f2", 100: "#c9e3e3", 500: "#1b7a80", 600: "#126469", 700: "#0d5c63", 800: "#0a474c" },
        positive: { DEFAULT: "#2b5fb0", soft: "#d8e3f4" },
        negative: { DEFAULT: "#c8661a", soft: "#f7e1cf" },
        caution: { DEFAULT: "#8a5a00", soft: "#fbf0d5", edge: "#e2b548" },
        danger: { DEFAULT: "#a32121", soft: "#f8dddd" },
        success: { DEFAULT: "#1f6b3a", soft: "#dcefe2" },
      },
      fontFamily: {
        sans: ['"Atkinson Hyperlegible"', "system-ui", "sans-serif"],
      },
    },
  },
} satisfies Config;
