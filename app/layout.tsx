import type { Metadata } from "next";
import localFont from "next/font/local";
import "./globals.css";

const inter = localFont({ src: "./inter-latin-wght-normal.woff2", variable: "--font-inter", display: "swap", weight: "100 900" });

export const metadata: Metadata = {
  title: { default: "Linkwright", template: "%s · Linkwright" },
  description: "Flight-control linkages, their hardware and their review, for people who build their own aircraft.",
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={inter.variable}>
      <body className="min-h-screen font-sans text-sm">
        {/* The first stop of every page: past the header and the build's tabs to what the page is for. */}
        <a href="#main" className="skip-link">Skip to the main content</a>
        {children}
      </body>
    </html>
  );
}
