import type { Metadata, Viewport } from "next";
import localFont from "next/font/local";
import { headers } from "next/headers";
import type { ReactNode } from "react";
import { ThemeScript } from "@/components/shell/theme-script";
import "./globals.css";

// Subsets of @fontsource/inter's latin files cut to the characters the app shows (scripts/subset-fonts.sh);
// semibold (600) uses the bold file, so three files are preloaded instead of four.
const inter = localFont({
  src: [
    { path: "./fonts/inter-subset-400-normal.woff2", weight: "400" },
    { path: "./fonts/inter-subset-700-normal.woff2", weight: "600 700" },
    { path: "./fonts/inter-subset-800-normal.woff2", weight: "800" },
  ],
  variable: "--font-inter",
  display: "swap",
});

export const metadata: Metadata = {
  title: { default: "Windowcall", template: "%s · Windowcall" },
  description: "Time task windows and flights at the field, score them by the class rules, and read a season of practice.",
  applicationName: "Windowcall",
  appleWebApp: { capable: true, title: "Windowcall", statusBarStyle: "default" },
  icons: { icon: "/icons/icon-192.png", apple: "/icons/icon-192.png" },
};

export const viewport: Viewport = {
  themeColor: "#000000",
  width: "device-width",
  initialScale: 1,
  viewportFit: "cover",
};

/** Reads this request's CSP nonce (set by proxy.ts), which also makes every page render per request. */
export default async function RootLayout({ children }: { children: ReactNode }) {
  const nonce = (await headers()).get("x-nonce") ?? undefined;
  return (
    <html lang="en" className={inter.variable} data-theme="outdoor" suppressHydrationWarning>
      <head>
        <ThemeScript nonce={nonce} />
      </head>
      <body className="min-h-dvh font-sans antialiased">
        {children}
      </body>
    </html>
  );
}
