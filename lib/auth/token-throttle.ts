// A fixed-window request counter per key (an API token's id), bounded in memory: past `maxKeys`
// the least recently started windows are dropped, so a flood of distinct keys cannot grow it.

export type WindowCounter = {
  /** Counts one request; returns 0 when it is allowed, else the milliseconds until the window resets. */
  hit(key: string, now?: number): number;
  size(): number;
};

export function createWindowCounter(opts: { limit: number; windowMs: number; maxKeys: number }): WindowCounter {
  const windows = new Map<string, { start: number; count: number }>();
  return {
    hit(key, now = Date.now()) {
      let w = windows.get(key);
      if (!w || now - w.start >= opts.windowMs) {
        windows.delete(key);
        w = { start: now, count: 0 };
        windows.set(key, w);
        while (windows.size > opts.maxKeys) {
          const oldest = windows.keys().next().value;
          if (oldest === undefined) break;
          windows.delete(oldest);
        }
      }
      if (w.count >= opts.limit) return Math.max(1, opts.windowMs - (now - w.start));
      w.count += 1;
      return 0;
    },
    size: () => windows.size,
  };
}
