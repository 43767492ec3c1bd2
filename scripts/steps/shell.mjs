// Running commands and saying so: the plain-Node basics every step uses (no dependencies, because
// the first step is installing them).
import { spawn, spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..", "..");

export const dataDir = path.join(root, ".data");

export const isRoot = typeof process.getuid === "function" && process.getuid() === 0;

export function log(message) {
  console.log(`[hangarleaf] ${message}`);
}

/** Runs a command to completion with its output shown; throws when it fails. */
export function run(command, args, options = {}) {
  const result = spawnSync(command, args, { stdio: "inherit", cwd: root, ...options });
  if (result.error) throw result.error;
  if (result.status !== 0) {
    throw new Error(`${command} ${args.join(" ")} exited with ${result.status ?? result.signal}`);
  }
}

/**
 * The same, without blocking this process: the services it supervises keep their logs flowing and
 * are restarted while a long test run goes on.
 */
export function runAsync(command, args, options = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: "inherit", cwd: root, ...options });
    child.on("error", reject);
    child.on("exit", (code, signal) =>
      code === 0 ? resolve() : reject(new Error(`${command} ${args.join(" ")} exited with ${code ?? signal}`)),
    );
  });
}

export function capture(command, args, options = {}) {
  const result = spawnSync(command, args, { encoding: "utf8", cwd: root, ...options });
  return { ok: result.status === 0, out: `${result.stdout ?? ""}${result.stderr ?? ""}`.trim() };
}

/** A random secret kept in .data so sessions survive a restart of `npm start`. */
export function localSecret(name) {
  mkdirSync(dataDir, { recursive: true });
  const file = path.join(dataDir, name);
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString("base64url"), { mode: 0o600 });
  return readFileSync(file, "utf8").trim();
}

// "server-only" modules resolve to nothing under the react-server condition, which is how the
// worker and the scripts share lib/ with the app.
export const tsxArgs = (script) => ["--conditions=react-server", script];

export function tsx(script, env) {
  run(path.join(root, "node_modules", ".bin", "tsx"), tsxArgs(script), { env });
}

export function bin(name) {
  return path.join(root, "node_modules", ".bin", name);
}

export function makeTempHome(prefix) {
  const dir = path.join(tmpdir(), `${prefix}-${randomBytes(4).toString("hex")}`);
  mkdirSync(dir, { recursive: true });
  chmodSync(dir, 0o755);
  return dir;
}
