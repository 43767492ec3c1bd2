// The API is declared once (lib/contracts/endpoints): every route file serves exactly the declared
// endpoints through handle(), and the README's table is the one made from the declarations.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { currentApiTable, renderApiTable } from "@/lib/contracts/api-table";
import { pathOf, shownPath } from "@/lib/contracts/endpoint";
import { allEndpoints, api } from "@/lib/contracts/endpoints";

const root = path.resolve(__dirname, "../..");

function routeFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return routeFiles(full);
    return name === "route.ts" ? [full] : [];
  });
}

/** app/api/cards/[id]/versions/[v]/route.ts → /api/cards/:id/versions/:v */
const pathOfFile = (file: string) =>
  "/" +
  path
    .relative(path.join(root, "app"), path.dirname(file))
    .split(path.sep)
    .map((s) => s.replace(/^\[(\w+)\]$/, ":$1"))
    .join("/");

const served = routeFiles(path.join(root, "app/api")).flatMap((file) => {
  const source = readFileSync(file, "utf8");
  return [...source.matchAll(/export (?:const|async function) (GET|POST|PUT|PATCH|DELETE)\b(?: = handle\(api\.(\w+)\.(\w+)\b)?/g)].map(
    (m) => ({
      file: path.relative(root, file),
      method: m[1]!,
      path: pathOfFile(file),
      endpoint: m[2] && m[3] ? (api as Record<string, Record<string, (typeof allEndpoints)[number]>>)[m[2]]?.[m[3]] : undefined,
    }),
  );
});

describe("the API contract", () => {
  it("serves every route through handle() with the endpoint of its own method and path", () => {
    const wrong = served.filter((s) => !s.endpoint || s.endpoint.method !== s.method || s.endpoint.path !== s.path);
    expect(wrong.map((s) => `${s.method} ${s.path} (${s.file})`)).toEqual([]);
  });

  it("declares no endpoint that no route serves, and none twice", () => {
    const keys = allEndpoints.map((e) => `${e.method} ${e.path}`);
    expect(new Set(keys).size).toBe(keys.length);
    const servedKeys = new Set(served.map((s) => `${s.method} ${s.path}`));
    expect(keys.filter((k) => !servedKeys.has(k))).toEqual([]);
  });

  it("keeps the README's API table as the declarations make it (npm run api:table)", () => {
    const readme = readFileSync(path.join(root, "README.md"), "utf8");
    expect(currentApiTable(readme)).toBe(renderApiTable(allEndpoints));
  });

  it("fills path segments encoded and shows them as {name} with the query's keys", () => {
    expect(pathOf(api.cards.getVersion.path, { id: "a/b", v: 3 })).toBe("/api/cards/a%2Fb/versions/3");
    expect(() => pathOf(api.cards.getVersion.path, { id: "x" })).toThrow(/:v/);
    expect(shownPath(api.cards.list)).toBe("/api/cards?status=&subject=&ata=&model=&q=");
    expect(shownPath(api.runs.buyOff)).toBe("/api/runs/{id}/buy-off");
  });

  it("refuses a segment that cannot name anything with a 404 worded for it, and a bad page number with a 422", () => {
    expect(() => api.cards.get.params.id("not-a-uuid")).toThrow("That task card was not found.");
    expect(api.cards.get.params.id("8F14E45F-CEEA-467F-A0E6-1B4A2D5C6E7A")).toBe("8f14e45f-ceea-467f-a0e6-1b4a2d5c6e7a");
    expect(() => api.cards.getVersion.params.v("0")).toThrow("That version of the task card was not found.");
    expect(() => api.cards.getVersion.params.v("1e3")).toThrow();
    expect(api.cards.getVersion.params.v("12")).toBe(12);
    expect(() => api.library.page.params.n("0")).toThrow("A page number is a whole number from 1.");
  });
});
