// A nodemailer transport that keeps each message in the database (the built-in outbox) instead of
// delivering it: the message is built by nodemailer exactly as it would go out, and the team it was
// sent for travels beside it as an option, not inside the text.
import "server-only";
import type { SendMailOptions, Transport } from "nodemailer";
import { storeMail } from "@/db/queries/mail";

/** sendMail options for the outbox: the team the message is sent for rides along. */
export type OutboxMailOptions = SendMailOptions & { teamId: string };

const MAX_RAW_BYTES = 2_000_000;

const asText = (v: unknown) => (typeof v === "string" ? v : "");

export function outboxTransport(): Transport<{ messageId: string }> {
  return {
    name: "sensewright-outbox",
    version: "1",
    send(mail, callback) {
      const data = mail.data as OutboxMailOptions;
      if (!data.teamId)
        return callback(new Error("outbox: a message must name the team it is sent for"), { messageId: "" });
      mail.message.build((error, raw) => {
        if (error) return callback(error, { messageId: "" });
        if (raw.length > MAX_RAW_BYTES) return callback(new Error("outbox: message too large"), { messageId: "" });
        storeMail({
          teamId: data.teamId,
          to: mail.message.getEnvelope().to.join(", "),
          from: asText(data.from),
          subject: asText(data.subject),
          text: asText(data.text).trimEnd(),
          raw: raw.toString("utf8"),
        }).then(
          () => callback(null, { messageId: mail.message.messageId() }),
          (e: unknown) => callback(e instanceof Error ? e : new Error(String(e)), { messageId: "" }),
        );
      });
    },
  };
}
