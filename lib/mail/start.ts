import { mailState } from "./transport";

/** Opens the mail transport at server start (and says where mail goes). */
export async function startMail(): Promise<void> {
  try {
    mailState();
  } catch (e) {
    // Mail is not worth refusing to start for: sends will retry opening and record failures.
    console.error("[mail] could not start:", (e as Error).message);
  }
}
