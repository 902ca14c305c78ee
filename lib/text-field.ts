// The one zod helper for free text a person types (design and part names, projects, comments,
// team and user names, file names). PostgreSQL cannot store a NUL character, and a lone UTF-16
// surrogate is not valid UTF-8, so either would fail the save deep in the database as a 500;
// they are refused here as a 422 on the field instead. Names are one line: line breaks collapse to
// a space, so a name cannot start a line of its own on a build sheet or in a mail.
import "@/lib/design/zod-jitless";
import { z } from "zod";

/** Control characters other than tab, line feed and carriage return (and DEL). */
const CONTROL = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/;
/** Every way a line can break: CR LF, CR, LF, vertical tab, form feed, NEL, line and paragraph separators. */
const LINE_BREAKS = /\r\n|[\n\r\u000b\u000c\u0085\u2028\u2029]/g;

/** The first lone surrogate's index, or -1 (a pair is one character; half a pair is not text). */
export function loneSurrogateAt(text: string): number {
  for (let k = 0; k < text.length; k++) {
    const c = text.charCodeAt(k);
    if (c >= 0xd800 && c <= 0xdbff) {
      const next = text.charCodeAt(k + 1);
      if (next >= 0xdc00 && next <= 0xdfff) k++;
      else return k;
    } else if (c >= 0xdc00 && c <= 0xdfff) return k;
  }
  return -1;
}

/** Why `text` cannot be stored, or null when it can. */
export function unstorableText(text: string, multiline: boolean): string | null {
  if (text.includes("\u0000")) return "contains a NUL character (U+0000), which cannot be stored";
  const control = multiline ? CONTROL.exec(text.replace(/[\u000b\u000c]/g, "\n")) : CONTROL.exec(text);
  if (control)
    return `contains the control character U+${control[0].charCodeAt(0).toString(16).toUpperCase().padStart(4, "0")}`;
  if (loneSurrogateAt(text) !== -1) return "contains half of a UTF-16 surrogate pair, which is not valid text";
  return null;
}

/** One line: every line break (and run of them) becomes a single space. */
export function oneLine(text: string): string {
  return text.replace(LINE_BREAKS, " ").replace(/ {2,}/g, " ");
}

type TextOptions = {
  /** Shown before each message: "Name", "Comment". */
  label: string;
  max: number;
  /** At least this many characters after trimming (default 0). */
  min?: number;
  /** The message when shorter than `min`. */
  minMessage?: string;
  /** Comments keep their line breaks; names are one line. */
  multiline?: boolean;
};

/** A trimmed text field that refuses NUL, other control characters and lone surrogates with 422. */
export function textField({ label, max, min = 0, minMessage, multiline = false }: TextOptions) {
  return z
    .string({ error: `${label}: expected text` })
    .check(
      z.superRefine((v: string, ctx) => {
        const why = unstorableText(v, true);
        if (why) ctx.addIssue({ code: "custom", message: `${label} ${why}` });
      }),
    )
    .transform((v) => (multiline ? v : oneLine(v)).trim())
    .pipe(
      z
        .string()
        .min(min, { error: minMessage ?? `${label} is required` })
        .max(max, { error: `${label}: at most ${max} characters` }),
    );
}
