// Types for scripts/system-tools.mjs (a plain Node script, imported by its unit test).
export type Probe = {
  which: (cmd: string) => boolean;
  exists: (file: string) => boolean;
  env?: Record<string, string | undefined>;
  isRoot: boolean;
  hasApt: boolean;
};
export type Plan = { action: "ok" | "install" | "stop"; missing: string[]; packages: string[]; command: string };
export function installCommand(packages: string[], opts: { isRoot: boolean }): string;
export function preflight(probe: Probe & { suites: string[] }): Plan;
export function machineProbe(): Probe;
export function ensureSystemTools(suites: string[], opts?: { install?: boolean; tag?: string; probe?: Probe }): boolean;
