import type { Config } from "tailwindcss";

/**
 * Cairn's palette: weathered stone neutrals with one accent, "lichen" (a deep green-teal).
 * Verdict colours always travel with a shape and a word (see components/ui/mark.tsx).
 */
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        stone: {
          50: "#f7f6f3",
          100: "#efede8",
          200: "#dedad1",
          300: "#c6c0b3",
          400: "#a29b8c",
          500: "#6e675c",
          600: "#5f594f",
          700: "#48433c",
          800: "#322f2a",
          900: "#1f1d1a",
        },
        lichen: { 50: "#eef6f3", 100: "#d3e9e1", 300: "#86bfae", 500: "#2f7d6b", 600: "#256656", 700: "#1d5044", 800: "#163d34" },
        verified: "#2f6f3e",
        refuted: "#a4332a",
        undecided: "#8a6a12",
      },
      maxWidth: { prose: "46rem" },
    },
  },
};

export default config;
