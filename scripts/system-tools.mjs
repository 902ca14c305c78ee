#!/usr/bin/env node
// The Debian tools the test suites need, checked before anything runs; used by `npm test`
// (scripts/test.mjs) and by CI (.ci/run). Missing tools are installed when we run as root with
// apt-get at hand; otherwise we stop with the exact command to run. Never a silent skip.
//
//   node scripts/system-tools.mjs [--install] [--postgres]
//     --install   install what is missing when root with apt-get (else print the command, exit 1)
//     --postgres  also the PostgreSQL 15 server binaries (CI's PostgreSQL run)
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";

/**
 * What each suite needs. `check` gets the injected probes so the logic can be tested without
 * touching the machine.
 */
export const TOOLS = [
  {
    name: "Chromium at /usr/bin/chromium",
    pkg: "chromium",
    suites: ["e2e"],
    check: ({ exists, env }) => exists(env.CHROMIUM_PATH || "/usr/bin/chromium"),
  },
  { name: "ngspice", pkg: "ngspice", suites: ["unit"], check: ({ which }) => which("ngspice") },
  // The worked scripts in examples/ (curl and jq; Python's standard library), run by examples.spec.ts.
  { name: "curl", pkg: "curl", suites: ["e2e"], check: ({ which }) => which("curl") },
  { name: "jq", pkg: "jq", suites: ["e2e"], check: ({ which }) => which("jq") },
  { name: "python3", pkg: "python3", suites: ["e2e"], check: ({ which }) => which("python3") },
  { name: "pdftoppm", pkg: "poppler-utils", suites: ["unit"], check: ({ which }) => which("pdftoppm") },
  { name: "pdftotext", pkg: "poppler-utils", suites: ["unit"], check: ({ which }) => which("pdftotext") },
  {
    name: "PostgreSQL 15 server binaries",
    pkg: "postgresql-15",
    suites: ["postgres"],
    check: ({ exists }) => exists("/usr/lib/postgresql/15/bin/initdb"),
  },
];

const APT_ENV = "DEBIAN_FRONTEND=noninteractive";

/** The apt-get line that installs `packages` (with sudo when not root). */
export function installCommand(packages, { isRoot }) {
  const sudo = isRoot ? "" : "sudo ";
  return `${sudo}apt-get update -qq && ${sudo}${APT_ENV} apt-get install -y -qq ${packages.join(" ")}`;
}

/**
 * Decides what to do before the suites run.
 * @param {{suites: string[], which: (cmd: string) => boolean, exists: (file: string) => boolean,
 *   env?: Record<string, string | undefined>, isRoot: boolean, hasApt: boolean}} probe
 * @returns {{action: "ok" | "install" | "stop", missing: string[], packages: string[], command: string}}
 */
export function preflight({ suites, which, exists, env = {}, isRoot, hasApt }) {
  const needed = TOOLS.filter((t) => t.suites.some((s) => suites.includes(s)));
  const missingTools = needed.filter((t) => !t.check({ which, exists, env }));
  const missing = missingTools.map((t) => t.name);
  const packages = [...new Set(missingTools.map((t) => t.pkg))];
  if (missing.length === 0) return { action: "ok", missing, packages, command: "" };
  const command = installCommand(packages, { isRoot });
  return { action: isRoot && hasApt ? "install" : "stop", missing, packages, command };
}

/** The real machine's probes. */
export function machineProbe() {
  const which = (cmd) =>
    (process.env.PATH ?? "")
      .split(path.delimiter)
      .filter(Boolean)
      .some((dir) => {
        try {
          fs.accessSync(path.join(dir, cmd), fs.constants.X_OK);
          return true;
        } catch {
          return false;
        }
      });
  const exists = (file) => {
    try {
      fs.accessSync(file, fs.constants.X_OK);
      return true;
    } catch {
      return false;
    }
  };
  return {
    which,
    exists,
    env: process.env,
    isRoot: typeof process.getuid === "function" && process.getuid() === 0,
    hasApt: which("apt-get"),
  };
}

/**
 * Checks the tools `suites` need and installs them when allowed. Returns true when everything is
 * present (or was just installed); prints why not otherwise. `tag` prefixes the lines.
 */
export function ensureSystemTools(suites, { install = true, tag = "[test]", probe = machineProbe() } = {}) {
  const plan = preflight({ suites, ...probe });
  if (plan.action === "ok") return true;
  if (plan.action === "install" && install) {
    console.log(`${tag} installing Debian packages the suites need: ${plan.packages.join(" ")}`);
    const res = spawnSync("sh", ["-c", `${plan.command} >/dev/null`], { stdio: ["ignore", "inherit", "inherit"] });
    const after = preflight({ suites, ...probe });
    if (res.status === 0 && after.action === "ok") return true;
    console.error(`${tag} apt-get could not install them; still missing: ${after.missing.join(", ")}`);
    return false;
  }
  console.error(`${tag} missing: ${plan.missing.join(", ")}. Install them, then run again:\n  ${plan.command}`);
  return false;
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(new URL(import.meta.url).pathname)) {
  const args = process.argv.slice(2);
  const suites = ["unit", "e2e", ...(args.includes("--postgres") ? ["postgres"] : [])];
  process.exit(ensureSystemTools(suites, { install: args.includes("--install"), tag: "[tools]" }) ? 0 : 1);
}
