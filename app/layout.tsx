import type { Metadata } from "next";
import type { ReactNode } from "react";
import { Providers } from "@/components/providers";
import { sans } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Sensewright", template: "%s · Sensewright" },
  description: "Design shunt-and-amplifier current-sense front ends across the whole current span.",
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={sans.variable}>
      <body className="min-h-screen font-sans text-sm">
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
