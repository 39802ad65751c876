// Root layout: self-hosted Inter (latin, plus latin-ext loaded only when a page needs it) and global styles.
import type { Metadata, Viewport } from "next";
import localFont from "next/font/local";
import { clsx } from "clsx";
import type { ReactNode } from "react";
import "./globals.css";


// Two families in one stack: the latin one comes first and carries no metric fallback of its own,
// so characters outside its range reach the latin-ext family instead of a system font. Unicode ranges
// are Fontsource's for these subset files; next/font wants them as literals here.
const interLatin = localFont({
  src: [
    { path: "../fonts/inter-latin-wght-normal.woff2", weight: "100 900", style: "normal" },
    { path: "../fonts/inter-latin-wght-italic.woff2", weight: "100 900", style: "italic" },
  ],
  variable: "--font-inter",
  declarations: [{ prop: "unicode-range", value: "U+0000-00FF,U+0131,U+0152-0153,U+02BB-02BC,U+02C6,U+02DA,U+02DC,U+0304,U+0308,U+0329,U+2000-206F,U+20AC,U+2122,U+2191,U+2193,U+2212,U+2215,U+FEFF,U+FFFD" }],
  adjustFontFallback: false,
});

const interLatinExt = localFont({
  src: [
    { path: "../fonts/inter-latin-ext-wght-normal.woff2", weight: "100 900", style: "normal" },
    { path: "../fonts/inter-latin-ext-wght-italic.woff2", weight: "100 900", style: "italic" },
  ],
  variable: "--font-inter-ext",
  declarations: [{ prop: "unicode-range", value: "U+0100-02BA,U+02BD-02C5,U+02C7-02CC,U+02CE-02D7,U+02DD-02FF,U+0304,U+0308,U+0329,U+1D00-1DBF,U+1E00-1E9F,U+1EF2-1EFF,U+2020,U+20A0-20AB,U+20AD-20C0,U+2113,U+2C60-2C7F,U+A720-A7FF" }],
  preload: false,
});

export const metadata: Metadata = {
  title: { default: "Plumbline", template: "%s · Plumbline" },
  description: "Video form review for strength coaches: bar path, joint angles, reps and bar speed from a phone clip.",
};

export const viewport: Viewport = {
  width: "device-width",
  initialScale: 1,
  colorScheme: "light dark",
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={clsx(interLatin.variable, interLatinExt.variable)}>
      <body className="min-h-dvh">{children}</body>
    </html>
  );
}
