// Services: ports, long-running children with prefixed logs, supervision with backoff, and the
// wait for the app to answer.
import { spawn } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import { createServer } from "node:net";
import path from "node:path";
import { log, root } from "./shell.mjs";

/** Fails early, in plain words, when another program (often a second `npm start`) holds a port. */
export function assertPortFree(port, what) {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once("error", (error) =>
      reject(
        new Error(
          error.code === "EADDRINUSE"
            ? `Port ${port} (${what}) is already in use, perhaps by another npm start. Stop it, or choose another port.`
            : `Port ${port} (${what}): ${error.message}`,
        ),
      ),
    );
    server.listen(port, () => server.close(() => resolve()));
  });
}

export function freePort() {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.unref();
    server.on("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const address = server.address();
      server.close(() => resolve(typeof address === "object" && address ? address.port : 0));
    });
  });
}

/** A long-running child whose lines are prefixed with its name; `stopAll` ends every one. */
const children = new Set();

export function service(name, command, args, env, onExit) {
  const child = spawn(command, args, { cwd: root, env, stdio: ["ignore", "pipe", "pipe"], detached: true });
  children.add(child);
  const prefix = (stream, out) => {
    let rest = "";
    stream.on("data", (chunk) => {
      const lines = (rest + chunk.toString()).split("\n");
      rest = lines.pop() ?? "";
      for (const line of lines) out.write(`[${name}] ${line}\n`);
    });
  };
  prefix(child.stdout, process.stdout);
  prefix(child.stderr, process.stderr);
  child.on("exit", (code, signal) => {
    children.delete(child);
    if (onExit) onExit(name, code, signal);
  });
  return child;
}

export let stoppingAll = false;

/** The backoff before the n-th restart in a row (1 s, 2 s, 4 s … at most 30 s). */
export function restartDelaySeconds(restartsInARow) {
  return Math.min(30, 2 ** Math.max(0, restartsInARow - 1));
}

/**
 * A service that is started again when it dies, after a backoff, and says so in the log: one dead
 * worker or fake must not take the web app and the database down with it. A service that stayed up
 * for a minute starts its backoff again from one second. With `pidFile`, the running child's pid
 * is written there at each start (the integration test that kills the worker reads it).
 */
export function supervise(name, command, args, env, { pidFile } = {}) {
  let restarts = 0;
  const start = () => {
    const startedAt = Date.now();
    const child = service(name, command, args, env, (_name, code, signal) => {
      if (stoppingAll) return;
      // What the dead process started (tsx runs the script in a child of its own) goes with it.
      try {
        process.kill(-child.pid, "SIGKILL");
      } catch {
        /* the whole group is gone already */
      }
      restarts = Date.now() - startedAt > 60_000 ? 1 : restarts + 1;
      const wait = restartDelaySeconds(restarts);
      log(`${name} stopped unexpectedly (${signal ?? `exit code ${code}`}); starting it again in ${wait} s (restart ${restarts} in a row)`);
      // Not unref'd: with every service down at once, this timer keeps the supervisor alive.
      setTimeout(() => {
        if (!stoppingAll) start();
      }, wait * 1000);
    });
    if (pidFile) {
      mkdirSync(path.dirname(pidFile), { recursive: true });
      writeFileSync(pidFile, String(child.pid));
    }
    return child;
  };
  start();
}

export async function stopAll() {
  stoppingAll = true;
  const waits = [...children].map(
    (child) =>
      new Promise((resolve) => {
        child.once("exit", resolve);
        try {
          process.kill(-child.pid, "SIGTERM");
        } catch {
          resolve();
        }
        setTimeout(() => {
          try {
            process.kill(-child.pid, "SIGKILL");
          } catch {
            /* already gone */
          }
          resolve();
        }, 8000).unref();
      }),
  );
  await Promise.all(waits);
}

export async function waitForHttp(url, seconds = 90) {
  const deadline = Date.now() + seconds * 1000;
  let last = "";
  while (Date.now() < deadline) {
    try {
      const response = await fetch(url);
      if (response.ok) return;
      last = `status ${response.status}`;
    } catch (error) {
      last = error instanceof Error ? error.message : String(error);
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`${url} did not answer within ${seconds} s (${last})`);
}
