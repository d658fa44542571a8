import type { Metadata, Viewport } from "next";
import { headers } from "next/headers";
import "@fontsource/ibm-plex-sans/400.css";
import "@fontsource/ibm-plex-sans/500.css";
import "@fontsource/ibm-plex-sans/600.css";
import "./globals.css";
import { Providers } from "@/components/providers";
import { ServiceWorker } from "@/components/offline/ServiceWorker";

export const metadata: Metadata = {
  title: { default: "Riseline", template: "%s · Riseline" },
  description: "Evacuation and decay-test records for HVAC/R crews: upload the micron log, read the verdict.",
  icons: { icon: "/riseline-mark.svg" },
};

export const viewport: Viewport = {
  width: "device-width",
  initialScale: 1,
  themeColor: [
    { media: "(prefers-color-scheme: light)", color: "#0b6e69" },
    { media: "(prefers-color-scheme: dark)", color: "#0f1a1f" },
  ],
};

/** Applies the saved theme (or the system's) before paint, so there is no flash. */
const themeScript = `try{var t=localStorage.getItem("rl-theme");if(t==="dark"||(!t&&matchMedia("(prefers-color-scheme: dark)").matches))document.documentElement.classList.add("dark")}catch(e){}`;

/**
 * Every page is rendered per request: the Content-Security-Policy's nonce (proxy.ts) is new each
 * time, and Next.js puts it on its own scripts; our one inline script carries it too.
 */
export default async function RootLayout({ children }: { children: React.ReactNode }) {
  const nonce = (await headers()).get("x-nonce") ?? undefined;
  return (
    <html lang="en" suppressHydrationWarning>
      <head>
        <script nonce={nonce} dangerouslySetInnerHTML={{ __html: themeScript }} />
      </head>
      <body className="min-h-dvh bg-surface text-fg antialiased">
        <Providers>{children}</Providers>
        <ServiceWorker />
      </body>
    </html>
  );
}
