import localFont from "next/font/local";

/**
 * Inter ships with the app (no download at build or run time). The Greek subset is a second family in
 * the font stack so that Γ, Δ, Σ, χ in k-path labels and fit statistics render in the same face.
 */
export const interLatin = localFont({
  src: "./fonts/inter-latin-wght-normal.woff2",
  variable: "--font-inter",
  weight: "100 900",
  display: "swap",
});

export const interGreek = localFont({
  src: "./fonts/inter-greek-wght-normal.woff2",
  variable: "--font-inter-greek",
  weight: "100 900",
  display: "swap",
  preload: false,
});
