import type { MetadataRoute } from "next";

/**
 * The web app manifest (W3C Web App Manifest): Riseline installs as a standalone app that opens
 * on the new-test screen, in our own colours (tide teal, tailwind.config.ts) with our own icons
 * (scripts/make-icons.ts draws them from the name mark).
 */
export default function manifest(): MetadataRoute.Manifest {
  return {
    id: "/",
    name: "Riseline — vacuum decay tests",
    short_name: "Riseline",
    description: "Capture a micron gauge's decay test, read the verdict, send it when signal returns.",
    start_url: "/vacuum-tests/new",
    scope: "/",
    display: "standalone",
    orientation: "portrait",
    background_color: "#eefaf8",
    theme_color: "#0b6e69",
    icons: [
      { src: "/icons/icon-192.png", sizes: "192x192", type: "image/png", purpose: "any" },
      { src: "/icons/icon-512.png", sizes: "512x512", type: "image/png", purpose: "any" },
      { src: "/icons/maskable-192.png", sizes: "192x192", type: "image/png", purpose: "maskable" },
      { src: "/icons/maskable-512.png", sizes: "512x512", type: "image/png", purpose: "maskable" },
      { src: "/riseline-mark.svg", sizes: "any", type: "image/svg+xml", purpose: "any" },
    ],
  };
}
