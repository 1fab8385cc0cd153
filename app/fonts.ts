import localFont from "next/font/local";

/** Fonts ship in the repository (SIL Open Font License); nothing is fetched at build or run time. */
export const bodyFont = localFont({
  src: "./fonts/InterTight-Variable.woff2",
  variable: "--font-body",
  weight: "100 900",
  display: "swap",
});

export const displayFont = localFont({
  src: "./fonts/SpaceGrotesk-Variable.woff2",
  variable: "--font-display",
  weight: "300 700",
  display: "swap",
});

export const monoFont = localFont({
  src: [
    { path: "./fonts/IBMPlexMono-Regular.woff2", weight: "400", style: "normal" },
    { path: "./fonts/IBMPlexMono-SemiBold.woff2", weight: "600", style: "normal" },
  ],
  variable: "--font-mono",
  display: "swap",
});
