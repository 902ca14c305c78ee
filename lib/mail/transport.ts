// One nodemailer transport for the process: SMTP_URL when set, else the local catcher.
import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/env";
import { startCatcher } from "./catcher";

type MailState = { transport: Transporter; catcher: boolean; close?: () => Promise<void> };

const key = Symbol.for("sensewright.mail");
type G = typeof globalThis & { [key]?: Promise<MailState> };
const g = globalThis as G;

async function open(): Promise<MailState> {
  const url = env().SMTP_URL;
  if (url) return { transport: nodemailer.createTransport(url), catcher: false };
  const { port, close } = await startCatcher();
  console.log(`[mail] no SMTP_URL: local mail catcher on 127.0.0.1:${port}; owners read it at /outbox`);
  const transport = nodemailer.createTransport({ host: "127.0.0.1", port, secure: false, ignoreTLS: true });
  return { transport, catcher: true, close };
}

/** The transport, opened on first use (the catcher starts then, or at server start). */
export function mailState(): Promise<MailState> {
  if (!g[key]) {
    g[key] = open().catch((e: unknown) => {
      delete g[key];
      throw e;
    });
  }
  return g[key];
}

/** Whether the built-in catcher (not a real SMTP server) takes the mail. */
export const usesCatcher = () => !env().SMTP_URL;
