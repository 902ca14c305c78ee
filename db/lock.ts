// PGlite has no lock of its own and two instances on one directory silently lose data,
// so the app holds an exclusive lock file in the data directory for as long as it runs.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";

export const LOCK_FILE = "sensewright.lock";

export class DataDirLockedError extends Error {
  constructor(
    readonly dir: string,
    readonly holderPid: number,
  ) {
    super(
      `The data directory ${dir} is already open in process ${holderPid}. ` +
        `Two processes on one PGlite directory lose data, so this one will not start. ` +
        `Stop process ${holderPid}, or set PGLITE_DIR to another directory.`,
    );
    this.name = "DataDirLockedError";
  }
}

type LockContent = { pid: number; host: string; startedAt: string };

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === "EPERM";
  }
}

function readLock(file: string): LockContent | null {
  try {
    return JSON.parse(fs.readFileSync(file, "utf8")) as LockContent;
  } catch {
    return null;
  }
}

/** Takes the lock (or confirms this process holds it); takes over a stale lock of a dead process. */
export function acquireDataDirLock(dir: string): void {
  fs.mkdirSync(dir, { recursive: true });
  const file = path.join(dir, LOCK_FILE);
  for (let attempt = 0; attempt < 5; attempt++) {
    try {
      const fd = fs.openSync(file, "wx");
      const content: LockContent = { pid: process.pid, host: os.hostname(), startedAt: new Date().toISOString() };
      fs.writeSync(fd, JSON.stringify(content));
      fs.closeSync(fd);
      const release = () => {
        if (readLock(file)?.pid === process.pid) fs.rmSync(file, { force: true });
      };
      process.once("exit", release);
      return;
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== "EEXIST") throw e;
      const holder = readLock(file);
      if (holder && holder.pid === process.pid) return;
      if (holder && holder.host === os.hostname() && isAlive(holder.pid)) {
        throw new DataDirLockedError(dir, holder.pid);
      }
      if (!holder) {
        // Another process may be between creating and writing the file: look again shortly.
        const ageMs = Date.now() - fs.statSync(file).mtimeMs;
        if (ageMs < 2000) {
          Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 200);
          continue;
        }
      }
      console.warn(`[db] taking over the stale lock of process ${holder?.pid ?? "unknown"} in ${dir}`);
      fs.rmSync(file, { force: true });
    }
  }
  throw new Error(`Could not take the lock on ${dir}`);
}
