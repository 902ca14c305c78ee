// Runs once when the server starts: secret, database (lock + migrations), demo data, local services.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { startServer } = await import("./lib/server-start");
  await startServer();
}
