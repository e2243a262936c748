import localFont from "next/font/local";

/** Source Serif 4 for prose and mathematics around KaTeX; Source Code Pro for graphs and certificates (both SIL OFL, see fonts/). */
export const textFace = localFont({
  src: [
    { path: "../fonts/source-serif-4-latin-400-normal.woff2", weight: "400", style: "normal" },
    { path: "../fonts/source-serif-4-latin-400-italic.woff2", weight: "400", style: "italic" },
    { path: "../fonts/source-serif-4-latin-600-normal.woff2", weight: "600", style: "normal" },
    { path: "../fonts/source-serif-4-latin-700-normal.woff2", weight: "700", style: "normal" },
  ],
  variable: "--font-text",
  display: "swap",
});

export const codeFace = localFont({
  src: [
    { path: "../fonts/source-code-pro-latin-400-normal.woff2", weight: "400", style: "normal" },
    { path: "../fonts/source-code-pro-latin-600-normal.woff2", weight: "600", style: "normal" },
  ],
  variable: "--font-code",
  display: "swap",
});
