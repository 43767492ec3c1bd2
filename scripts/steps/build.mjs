// Building: whether the production build is stale, pdf.js's assets, and the service worker.
import { copyFileSync, existsSync, mkdirSync, readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { log, root } from "./shell.mjs";

/** True when the production build is older than any source file, or missing. */
export function buildIsStale() {
  const buildId = path.join(root, ".next", "BUILD_ID");
  if (!existsSync(buildId)) return true;
  const built = statSync(buildId).mtimeMs;
  const newest = (dir) => {
    let max = 0;
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) max = Math.max(max, newest(full));
      else max = Math.max(max, statSync(full).mtimeMs);
    }
    return max;
  };
  const sources = ["app", "components", "lib", "db", "search", "public"].map((d) => path.join(root, d));
  const files = ["package-lock.json", "next.config.ts", "proxy.ts", "postcss.config.mjs"].map((f) => path.join(root, f));
  const mtimes = [...sources.filter(existsSync).map(newest), ...files.filter(existsSync).map((f) => statSync(f).mtimeMs)];
  return mtimes.some((m) => m > built);
}

/**
 * The browser's PDF reader needs pdf.js's worker and standard fonts as files of the same version
 * as the library: copied from node_modules into public/ (git-ignored) before each build. Only what
 * differs is copied, so an unchanged copy does not make the build look stale.
 */
export function copyPdfAssets() {
  const from = path.join(root, "node_modules", "pdfjs-dist");
  const copy = (source, target) => {
    if (existsSync(target) && statSync(target).size === statSync(source).size) return;
    mkdirSync(path.dirname(target), { recursive: true });
    copyFileSync(source, target);
  };
  copy(path.join(from, "build", "pdf.worker.min.mjs"), path.join(root, "public", "pdf.worker.min.mjs"));
  for (const name of readdirSync(path.join(from, "standard_fonts"))) {
    copy(path.join(from, "standard_fonts", name), path.join(root, "public", "standard_fonts", name));
  }
}

/**
 * The service worker, made after `next build` (it precaches the build's own files, so it can only be
 * made once they exist): esbuild bundles service-worker/sw.ts, then @serwist/build's injectManifest
 * writes the precache list into it, to .next/hangarleaf-sw.js, which app/sw.js/route.ts serves.
 * Files under /_next/static are named by their hash already; the rest get a revision from their
 * content, and the cart's two page shells the build id.
 */
export async function buildServiceWorker() {
  const { build } = await import("esbuild");
  const { injectManifest } = await import("@serwist/build");
  const next = path.join(root, ".next");
  const buildId = readFileSync(path.join(next, "BUILD_ID"), "utf8").trim();
  const bundled = path.join(next, "hangarleaf-sw.src.js");
  await build({
    entryPoints: [path.join(root, "service-worker", "sw.ts")],
    outfile: bundled,
    bundle: true,
    format: "iife",
    target: "es2022",
    minify: true,
    tsconfig: path.join(root, "tsconfig.json"),
    define: { "process.env.NODE_ENV": '"production"' },
    logLevel: "warning",
  });
  const { count, warnings } = await injectManifest({
    swSrc: bundled,
    swDest: path.join(next, "hangarleaf-sw.js"),
    globDirectory: root,
    globPatterns: [".next/static/**/*", "public/pdf.worker.min.mjs", "public/icon.svg", "public/standard_fonts/**/*"],
    globIgnores: ["**/*.map"],
    modifyURLPrefix: { ".next/static/": "/_next/static/", "public/": "/" },
    dontCacheBustURLsMatching: /^\/_next\/static\//,
    // The reader's worker is about 1 MB; nothing the cart needs may be left out for its size.
    maximumFileSizeToCacheInBytes: 32 * 1024 * 1024,
    additionalPrecacheEntries: [
      { url: "/cart", revision: buildId },
      { url: "/cart/run", revision: buildId },
    ],
  });
  for (const warning of warnings) log(`service worker: ${warning}`);
  log(`service worker built: ${count} files precached`);
}
