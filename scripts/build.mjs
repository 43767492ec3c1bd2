// `npm run build`: pdf.js's assets into public/, the Next production build, then the service worker.
import { bin, run } from "./steps/shell.mjs";
import { buildServiceWorker, copyPdfAssets } from "./steps/build.mjs";

copyPdfAssets();
run(bin("next"), ["build"]);
await buildServiceWorker();
