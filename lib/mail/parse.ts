// Reads what the local catcher receives: headers, the plain-text part, quoted-printable or
// base64 bodies and encoded-word subjects — the subset nodemailer produces. No outside parser.

export type ParsedMail = { to: string; from: string; subject: string; text: string };

type Part = { headers: Record<string, string>; body: string };

function splitHeaders(raw: string): Part {
  const normalized = raw.replace(/\r\n/g, "\n");
  const end = normalized.indexOf("\n\n");
  const head = end === -1 ? normalized : normalized.slice(0, end);
  const body = end === -1 ? "" : normalized.slice(end + 2);
  const headers: Record<string, string> = {};
  let last = "";
  for (const line of head.split("\n")) {
    if (/^[ \t]/.test(line) && last) headers[last] += ` ${line.trim()}`;
    else {
      const i = line.indexOf(":");
      if (i <= 0) continue;
      last = line.slice(0, i).trim().toLowerCase();
      headers[last] = line.slice(i + 1).trim();
    }
  }
  return { headers, body };
}

function decodeBytes(bytes: number[], charset: string): string {
  try {
    return new TextDecoder(charset || "utf-8").decode(new Uint8Array(bytes));
  } catch {
    return new TextDecoder("utf-8").decode(new Uint8Array(bytes));
  }
}

export function decodeQuotedPrintable(input: string, charset = "utf-8"): string {
  const soft = input.replace(/=\n/g, "");
  const bytes: number[] = [];
  for (let i = 0; i < soft.length; i++) {
    const c = soft[i]!;
    const hex = soft.slice(i + 1, i + 3);
    if (c === "=" && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else for (const b of new TextEncoder().encode(c)) bytes.push(b);
  }
  return decodeBytes(bytes, charset);
}

const decodeBase64 = (input: string, charset = "utf-8") =>
  decodeBytes([...Buffer.from(input.replace(/\s+/g, ""), "base64")], charset);

/** RFC 2047 encoded words (=?UTF-8?Q?…?= and =?UTF-8?B?…?=), as nodemailer writes non-ASCII subjects. */
export function decodeWords(value: string): string {
  return value
    .replace(/\?=\s+=\?/g, "?==?")
    .replace(/=\?([^?]+)\?([QqBb])\?([^?]*)\?=/g, (_, charset: string, enc: string, text: string) =>
      enc.toUpperCase() === "B" ? decodeBase64(text, charset) : decodeQuotedPrintable(text.replace(/_/g, " "), charset),
    );
}

const param = (header: string | undefined, name: string) =>
  new RegExp(`${name}="?([^";]+)"?`, "i").exec(header ?? "")?.[1];

function decodeBody(part: Part): string {
  const enc = (part.headers["content-transfer-encoding"] ?? "").toLowerCase();
  const charset = param(part.headers["content-type"], "charset") ?? "utf-8";
  if (enc === "quoted-printable") return decodeQuotedPrintable(part.body, charset);
  if (enc === "base64") return decodeBase64(part.body, charset);
  return part.body;
}

function plainText(part: Part): string | null {
  const type = (part.headers["content-type"] ?? "text/plain").toLowerCase();
  if (type.startsWith("multipart/")) {
    const boundary = param(part.headers["content-type"], "boundary");
    if (!boundary) return null;
    const chunks = part.body.split(`--${boundary}`).slice(1);
    for (const chunk of chunks) {
      if (chunk.startsWith("--")) break;
      const found = plainText(splitHeaders(chunk.replace(/^\n/, "")));
      if (found !== null) return found;
    }
    return null;
  }
  return type.startsWith("text/plain") ? decodeBody(part) : null;
}

export function parseMail(raw: string): ParsedMail {
  const top = splitHeaders(raw);
  return {
    to: decodeWords(top.headers.to ?? ""),
    from: decodeWords(top.headers.from ?? ""),
    subject: decodeWords(top.headers.subject ?? ""),
    text: (plainText(top) ?? "").replace(/\n+$/, "\n").trimEnd(),
  };
}
