/** Plinthwise theme: a concrete-and-basalt palette of our own, a compact type
 *  scale for dense engineering tables, and a 4 px spacing rhythm. */
/** @type {import('tailwindcss').Config} */
const config = {
  content: ["./app/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        basalt: { 50: "#f2f4f5", 100: "#dde3e6", 200: "#b9c5cb", 300: "#8ea2ab", 400: "#566e79", 500: "#4a616c", 600: "#3a4d57", 700: "#2e3d46", 800: "#222e35", 900: "#172026" },
        grout: { 50: "#faf9f7", 100: "#f1efea", 200: "#e3dfd6", 300: "#cdc6b8", 400: "#a99f8c" },
        ochre: { 100: "#fbefd5", 300: "#f0c76e", 500: "#d49a1e", 700: "#8f650f" },
        moss: { 100: "#e2f0e0", 500: "#3f8a4a", 700: "#2b6233" },
        brick: { 100: "#f8e1dc", 500: "#b8432f", 700: "#84291b" },
      },
      fontFamily: {
        sans: ["var(--font-plex-sans)", "system-ui", "sans-serif"],
        mono: ["var(--font-plex-mono)", "ui-monospace", "monospace"],
      },
      fontSize: {
        "2xs": ["0.6875rem", { lineHeight: "1rem" }],
        xs: ["0.75rem", { lineHeight: "1.1rem" }],
        sm: ["0.8125rem", { lineHeight: "1.25rem" }],
        base: ["0.9375rem", { lineHeight: "1.45rem" }],
        lg: ["1.125rem", { lineHeight: "1.6rem" }],
        xl: ["1.375rem", { lineHeight: "1.8rem" }],
        "2xl": ["1.75rem", { lineHeight: "2.2rem" }],
      },
      spacing: { 4.5: "1.125rem", 13: "3.25rem", 18: "4.5rem" },
      borderRadius: { plinth: "3px" },
      boxShadow: { slab: "0 1px 0 rgba(23,32,38,0.08), 0 2px 6px rgba(23,32,38,0.06)" },
    },
  },
  plugins: [],
};

export default config;
