import { mailState } from "./transport";

/** Starts the built-in mail catcher when SMTP_URL is unset (or opens the SMTP transport). */
export async function startMail(): Promise<void> {
  try {
    await mailState();
  } catch (e) {
    // Mail is not worth refusing to start for: sends will retry opening and record failures.
    console.error("[mail] could not start:", (e as Error).message);
  }
}
