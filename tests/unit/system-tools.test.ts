// The preflight of `npm test` (scripts/system-tools.mjs) with a fake machine: which tools each
// suite needs, when it installs and when it stops with the command to run.
import { describe, expect, it } from "vitest";
import { installCommand, preflight as plan } from "../../scripts/system-tools.mjs";

/** A machine that has exactly the commands and files given. */
function machine(commands: string[], files: string[], opts: { isRoot: boolean; hasApt: boolean }) {
  return {
    which: (cmd: string) => commands.includes(cmd),
    exists: (file: string) => files.includes(file),
    env: {},
    ...opts,
  };
}

/** What the worked scripts in examples/ need (the e2e suite runs them). */
const scripting = ["curl", "jq", "python3"];

const everything = machine(
  ["ngspice", "pdftoppm", "pdftotext", ...scripting],
  ["/usr/bin/chromium", "/usr/lib/postgresql/15/bin/initdb"],
  { isRoot: false, hasApt: true },
);

describe("system tools preflight", () => {
  it("does nothing when every tool is present", () => {
    expect(plan({ suites: ["unit", "e2e", "postgres"], ...everything })).toMatchObject({ action: "ok", missing: [] });
  });

  it("installs the missing packages (each once) as root with apt-get", () => {
    const m = machine(["pdftotext", ...scripting], [], { isRoot: true, hasApt: true });
    const p = plan({ suites: ["unit", "e2e"], ...m });
    expect(p.action).toBe("install");
    expect(p.missing).toEqual(["Chromium at /usr/bin/chromium", "ngspice", "pdftoppm"]);
    expect(p.packages).toEqual(["chromium", "ngspice", "poppler-utils"]);
    expect(p.command).toBe(
      "apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium ngspice poppler-utils",
    );
  });

  it("stops with a sudo command when not root", () => {
    const m = machine(["pdftoppm", "pdftotext", ...scripting], ["/usr/bin/chromium"], { isRoot: false, hasApt: true });
    const p = plan({ suites: ["unit", "e2e"], ...m });
    expect(p.action).toBe("stop");
    expect(p.missing).toEqual(["ngspice"]);
    expect(p.command).toBe(
      "sudo apt-get update -qq && sudo DEBIAN_FRONTEND=noninteractive apt-get install -y -qq ngspice",
    );
  });

  it("stops when root but apt-get is absent", () => {
    const m = machine([], ["/usr/bin/chromium"], { isRoot: true, hasApt: false });
    expect(plan({ suites: ["e2e", "unit"], ...m }).action).toBe("stop");
  });

  it("asks only for what the chosen suites need", () => {
    const noBrowser = machine(["ngspice", "pdftoppm", "pdftotext", ...scripting], [], { isRoot: false, hasApt: true });
    expect(plan({ suites: ["unit"], ...noBrowser }).action).toBe("ok");
    expect(plan({ suites: ["e2e"], ...noBrowser }).missing).toEqual(["Chromium at /usr/bin/chromium"]);
    // PostgreSQL 15 only for CI's PostgreSQL run.
    const noPg = machine(["ngspice", "pdftoppm", "pdftotext", ...scripting], ["/usr/bin/chromium"], {
      isRoot: true,
      hasApt: true,
    });
    expect(plan({ suites: ["unit", "e2e"], ...noPg }).action).toBe("ok");
    expect(plan({ suites: ["unit", "e2e", "postgres"], ...noPg }).packages).toEqual(["postgresql-15"]);
  });

  it("looks for Chromium where CHROMIUM_PATH points", () => {
    const m = {
      ...machine(scripting, ["/opt/browser/chrome"], { isRoot: false, hasApt: true }),
      env: { CHROMIUM_PATH: "/opt/browser/chrome" },
    };
    expect(plan({ suites: ["e2e"], ...m }).action).toBe("ok");
  });

  it("asks for curl, jq and python3 for the browser and HTTP suites, which run the example scripts", () => {
    const noJq = machine(["ngspice", "pdftoppm", "pdftotext", "curl", "python3"], ["/usr/bin/chromium"], {
      isRoot: true,
      hasApt: true,
    });
    expect(plan({ suites: ["unit"], ...noJq }).action).toBe("ok");
    expect(plan({ suites: ["e2e"], ...noJq })).toMatchObject({ action: "install", missing: ["jq"], packages: ["jq"] });
  });

  it("writes the install line with sudo only when not root", () => {
    expect(installCommand(["a", "b"], { isRoot: true })).not.toContain("sudo");
    expect(installCommand(["a"], { isRoot: false }).match(/sudo/g)).toHaveLength(2);
  });
});
