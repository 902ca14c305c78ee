/** Starts the built-in mail catcher when SMTP_URL is unset (filled in by the review feature). */
export async function startMail(): Promise<void> {}
