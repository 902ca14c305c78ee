import localFont from "next/font/local";

// Inter ships with the app from the npm font package: no network at build or run time.
export const sans = localFont({
  src: "../node_modules/@fontsource-variable/inter/files/inter-latin-wght-normal.woff2",
  variable: "--font-sans",
  weight: "100 900",
  display: "swap",
});
