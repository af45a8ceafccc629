import localFont from "next/font/local";

export const sans = localFont({
  src: "../public/fonts/inter-latin-wght.woff2",
  variable: "--font-sans",
  display: "swap",
  weight: "100 900",
});
