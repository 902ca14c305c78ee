// react-pdf's Text with breaks inside a word made a last resort. react-pdf may break a line where
// a word changes script ("mΩ" is Latin then Greek) and marks the break with a hyphen; at its
// default cost it sometimes prefers that to a space, printing "m-" and "Ω" on two lines. At this
// cost such a break is taken only when no space break can fit the line (a name without spaces).
import { Text as PdfText } from "@react-pdf/renderer";
import type { ComponentProps } from "react";

const IN_WORD_BREAK_PENALTY = 5000;

export function Text(props: ComponentProps<typeof PdfText>) {
  return <PdfText hyphenationPenalty={IN_WORD_BREAK_PENALTY} {...props} />;
}
