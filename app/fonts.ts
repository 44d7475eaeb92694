import localFont from "next/font/local";

// Both faces ship in fonts/ (copied from the @fontsource-variable packages): no download at build or run time.
export const sans = localFont({
  src: [
    { path: "../fonts/inter-latin-wght.woff2", weight: "100 900", style: "normal" },
    { path: "../fonts/inter-latin-ext-wght.woff2", weight: "100 900", style: "normal" },
  ],
  variable: "--font-sans",
  display: "swap",
});

export const mono = localFont({
  src: [{ path: "../fonts/jetbrains-mono-latin-wght.woff2", weight: "100 800", style: "normal" }],
  variable: "--font-mono",
  display: "swap",
});
