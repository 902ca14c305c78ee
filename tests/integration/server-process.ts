// The test server's own process, found by the TCP port it listens on (Linux /proc), so a test can
// read its memory: the socket's inode from /proc/net/tcp{,6}, then the process holding that inode.
import fs from "node:fs";

function listeningInodes(port: number): Set<string> {
  const inodes = new Set<string>();
  const hexPort = port.toString(16).toUpperCase().padStart(4, "0");
  for (const file of ["/proc/net/tcp", "/proc/net/tcp6"]) {
    let text = "";
    try {
      text = fs.readFileSync(file, "utf8");
    } catch {
      continue;
    }
    for (const line of text.split("\n").slice(1)) {
      const cols = line.trim().split(/\s+/);
      // local_address is "ADDR:PORT"; state 0A is LISTEN; the inode is the tenth column.
      if (cols.length > 9 && cols[1]?.endsWith(`:${hexPort}`) && cols[3] === "0A") inodes.add(cols[9]!);
    }
  }
  return inodes;
}

/** The pid of the process listening on `port`, or null when it cannot be found. */
export function pidListeningOn(port: number): number | null {
  const inodes = listeningInodes(port);
  if (inodes.size === 0) return null;
  for (const entry of fs.readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    let fds: string[];
    try {
      fds = fs.readdirSync(`/proc/${entry}/fd`);
    } catch {
      continue; // another user's process, or gone
    }
    for (const fd of fds) {
      let target = "";
      try {
        target = fs.readlinkSync(`/proc/${entry}/fd/${fd}`);
      } catch {
        continue;
      }
      const m = /^socket:\[(\d+)\]$/.exec(target);
      if (m && inodes.has(m[1]!)) return Number(entry);
    }
  }
  return null;
}

/** Resident memory of a process in bytes (VmRSS), or null when gone. */
export function rssBytes(pid: number): number | null {
  try {
    const m = /^VmRSS:\s+(\d+)\s+kB/m.exec(fs.readFileSync(`/proc/${pid}/status`, "utf8"));
    return m ? Number(m[1]) * 1024 : null;
  } catch {
    return null;
  }
}
