// The default "date built" of a unit, in a module of its own: the recording form needs it on first
// paint, without the schemas (and the unit parser they read quantities with).

/** Today's date in UTC as YYYY-MM-DD (the default "date built"). */
export function todayIso(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}
