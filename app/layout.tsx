import type { Metadata } from "next";
import { sans } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Coatwright", template: "%s · Coatwright" },
  description: "Planning for the finishing department: surface area, film build, material, racking and cure.",
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={sans.variable}>
      <body className="min-h-screen">{children}</body>
    </html>
  );
}
