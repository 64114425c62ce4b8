import type { Config } from "tailwindcss";

/**
 * Sagline's palette: river water at dusk — a muted teal for action, warm
 * paper for the page, reed green for "meets the criterion", ochre and clay
 * for "close" and "below". Kept calm so that the DO colours on the map and
 * in tables are what draws the eye.
 */
const config: Config = {
  content: [],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: "#1d2a33", soft: "#43535e", faint: "#6f7d86" },
        paper: { DEFAULT: "#f7f6f1", raised: "#ffffff", sunk: "#efede6" },
        rule: { DEFAULT: "#d9d6cc", strong: "#b9b5a8" },
        tarn: { 50: "#eef6f5", 100: "#d3e8e6", 300: "#7fb1ae", 500: "#3d8184", 600: "#2f6f73", 700: "#245659", 900: "#143234" },
        reed: { 100: "#e7ecd9", 500: "#7b8f4a", 700: "#55652f" },
        ochre: { 100: "#f6ead2", 500: "#c08a2e", 700: "#8a5f17" },
        clay: { 100: "#f6e1da", 500: "#b5523b", 700: "#853726" },
      },
      fontFamily: {
        sans: ["var(--font-sagline)", "system-ui", "sans-serif"],
      },
      borderRadius: { card: "10px" },
    },
  },
};

export default config;
