// The Content-Security-Policy (next.config.ts) forbids eval. zod 4 would probe for it with
// `new Function("")` when it builds its first object schema, and the browser reports the caught
// attempt as a CSP violation on every page; jitless skips the probe and the compiled fast path
// (requests parse a few objects each, so the interpreted path costs nothing noticeable).
// Imported first by the modules that build schemas the browser and the solver's worker load.
import { z } from "zod";

z.config({ jitless: true });
