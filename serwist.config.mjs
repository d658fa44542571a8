// @ts-check
/**
 * `serwist build` (after `next build`): bundles lib/offline/sw/service-worker.ts with esbuild into
 * public/sw.js and injects the precache list of the build's static files and public/.
 */
/** @type {import("@serwist/cli").BuildOptions} */
const config = {
  swSrc: "lib/offline/sw/service-worker.ts",
  swDest: "public/sw.js",
  globDirectory: ".",
  globPatterns: [".next/static/**/*.{js,css,woff,woff2}", "public/**/*.{svg,png,ico,webmanifest}"],
  globIgnores: ["public/sw.js"],
  modifyURLPrefix: { ".next/static/": "/_next/static/", "public/": "/" },
  // Hashed file names under /_next/static need no revision of their own.
  dontCacheBustURLsMatching: /^\/_next\/static\//,
  maximumFileSizeToCacheInBytes: 4 * 1024 * 1024,
  esbuildOptions: { tsconfig: "lib/offline/sw/tsconfig.json", define: { "process.env.NODE_ENV": '"production"' } },
  injectionPoint: "self.__SW_MANIFEST",
};

export default config;
