import type { Metadata } from "next";
import { connection } from "next/server";
import "katex/dist/katex.min.css";
import "./globals.css";
import { codeFace, textFace } from "./fonts";

export const metadata: Metadata = {
  title: { default: "Cairn", template: "%s · Cairn" },
  description: "Case-by-case review of classification proofs, with exactly verified computational certificates.",
  // Drawn for Cairn by scripts/draw-icons.mjs and served from public/.
  icons: {
    icon: [
      { url: "/favicon.svg", type: "image/svg+xml" },
      { url: "/favicon.ico", sizes: "16x16 32x32" },
    ],
    apple: "/apple-touch-icon.png",
  },
};

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page is rendered per request, so that Next.js can put this request's CSP nonce on its scripts (proxy.ts).
  await connection();
  return (
    <html lang="en" className={`${textFace.variable} ${codeFace.variable}`}>
      <body className="min-h-screen antialiased">{children}</body>
    </html>
  );
}
