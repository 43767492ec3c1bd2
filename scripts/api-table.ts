// `npm run api:table`: writes the README's API table from lib/contracts/endpoints.
import { readFileSync, writeFileSync } from "node:fs";
import { renderApiTable, withApiTable } from "../lib/contracts/api-table";
import { allEndpoints } from "../lib/contracts/endpoints";

const path = new URL("../README.md", import.meta.url);
const before = readFileSync(path, "utf8");
const after = withApiTable(before, renderApiTable(allEndpoints));
if (after === before) console.log("README.md: the API table is current.");
else {
  writeFileSync(path, after);
  console.log(`README.md: API table written (${allEndpoints.length} endpoints).`);
}
