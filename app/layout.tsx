import type { Metadata, Viewport } from "next";
import localFont from "next/font/local";
import { headers } from "next/headers";
import { nonceOf } from "@/server/http/content-security-policy";
import "./globals.css";

const inter = localFont({
  src: "./fonts/inter-latin-wght-normal.woff2",
  weight: "400 700",
  display: "swap",
  variable: "--font-inter",
});

export const metadata: Metadata = {
  title: { default: "Keelson", template: "%s · Keelson" },
  description: "Planned maintenance for the engine department and the technical office.",
};

export const viewport: Viewport = {
  width: "device-width",
  initialScale: 1,
  themeColor: [
    { media: "(prefers-color-scheme: light)", color: "#f5f7f9" },
    { media: "(prefers-color-scheme: dark)", color: "#0d1218" },
  ],
};

// Sets the theme before first paint: the stored choice, else the device's preference.
const themeScript = `try{var t=localStorage.getItem("keelson-theme");if(t==="dark"||(!t&&matchMedia("(prefers-color-scheme: dark)").matches))document.documentElement.classList.add("dark")}catch(e){}`;

// Reading the request makes every page render per request, as the nonce of the Content-Security-
// Policy (proxy.ts) requires: a page prerendered at build would carry scripts without it.
export default async function RootLayout({ children }: { children: React.ReactNode }) {
  const nonce = nonceOf((await headers()).get("content-security-policy"));
  return (
    <html lang="en" className={inter.variable} suppressHydrationWarning>
      <head>
        <script nonce={nonce} dangerouslySetInnerHTML={{ __html: themeScript }} />
      </head>
      <body className="min-h-screen font-sans text-sm antialiased">{children}</body>
    </html>
  );
}
