// The built-in local mail catcher: a real SMTP server on 127.0.0.1 that keeps every message in
// the database, so mail takes the same nodemailer path with or without SMTP_URL.
import "server-only";
import { SMTPServer } from "smtp-server";
import { storeMail } from "@/db/queries/mail";
import { parseMail } from "./parse";

const MAX_BYTES = 2_000_000;

export function startCatcher(): Promise<{ port: number; close: () => Promise<void> }> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    size: MAX_BYTES,
    logger: false,
    banner: "Sensewright local mail catcher",
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (c: Buffer) => chunks.push(c));
      stream.on("end", () => {
        if (stream.sizeExceeded) return callback(Object.assign(new Error("Message too large"), { responseCode: 552 }));
        const raw = Buffer.concat(chunks).toString("utf8");
        const parsed = parseMail(raw);
        storeMail({ ...parsed, raw })
          .then(() => callback())
          .catch((e: unknown) => {
            console.error("[mail] catcher could not store a message", e);
            callback(Object.assign(new Error("Could not store the message"), { responseCode: 451 }));
          });
      });
    },
  });
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const address = server.server.address();
      const port = typeof address === "object" && address ? address.port : 0;
      resolve({ port, close: () => new Promise<void>((r) => server.close(() => r())) });
    });
  });
}
