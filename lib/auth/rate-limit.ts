// Failed sign-ins per e-mail and per client address, in a sliding window (per process).
export type Limiter = {
  /** Milliseconds until another attempt is allowed, or 0 when allowed now. */
  retryAfterMs(key: string, now?: number): number;
  fail(key: string, now?: number): void;
  reset(key: string): void;
};

export function createLimiter(maxFailures: number, windowMs: number): Limiter {
  const failures = new Map<string, number[]>();
  const recent = (key: string, now: number) => {
    const kept = (failures.get(key) ?? []).filter((t) => now - t < windowMs);
    if (kept.length) failures.set(key, kept);
    else failures.delete(key);
    return kept;
  };
  return {
    retryAfterMs(key, now = Date.now()) {
      const list = recent(key, now);
      if (list.length < maxFailures) return 0;
      const oldest = list[list.length - maxFailures] ?? now;
      return Math.max(0, windowMs - (now - oldest));
    },
    fail(key, now = Date.now()) {
      failures.set(key, [...recent(key, now), now]);
    },
    reset(key) {
      failures.delete(key);
    },
  };
}

const WINDOW_MS = 15 * 60 * 1000;
const g = globalThis as typeof globalThis & { __swLimiters?: { byEmail: Limiter; byAddress: Limiter } };
export const signInLimiters = (g.__swLimiters ??= {
  byEmail: createLimiter(5, WINDOW_MS),
  byAddress: createLimiter(20, WINDOW_MS),
});
