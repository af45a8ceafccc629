import type { Config } from "tailwindcss";

// Coatwright's own palette: cured-steel greys, a phosphate green-teal for actions, oxide for warnings.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: "#1e262d", soft: "#3f4c57", faint: "#586470" },
        plate: { DEFAULT: "#f5f5f1", raised: "#ffffff", sunk: "#e8e9e3", line: "#d3d6cf" },
        phosphate: { DEFAULT: "#1d6b63", dark: "#144c46", light: "#d8ebe7" },
        oxide: { DEFAULT: "#a8461f", light: "#f7e3d8" },
        caution: { DEFAULT: "#8a6100", light: "#fbf1cf", edge: "#e0b84a" },
        pass: { DEFAULT: "#2f6b2a", light: "#e0f0dc" },
      },
      fontFamily: { sans: ["var(--font-sans)", "system-ui", "sans-serif"] },
    },
  },
};
export default config;
