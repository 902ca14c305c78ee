// One nodemailer transport for the process: SMTP_URL when set, else the built-in outbox (the database).
import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/env";
import { outboxTransport } from "./outbox-transport";

type MailState = { transport: Transporter; outbox: boolean };

const key = Symbol.for("sensewright.mail");
type G = typeof globalThis & { [key]?: MailState };
const g = globalThis as G;

function open(): MailState {
  const url = env().SMTP_URL;
  if (url) return { transport: nodemailer.createTransport(url), outbox: false };
  console.log("[mail] no SMTP_URL: mail is kept in the built-in outbox; owners read it at /outbox");
  return { transport: nodemailer.createTransport(outboxTransport()), outbox: true };
}

/** The process's transport, made on first use. */
export function mailState(): MailState {
  return (g[key] ??= open());
}

/** Whether the built-in outbox (not a real SMTP server) takes the mail. */
export const usesOutbox = () => !env().SMTP_URL;
