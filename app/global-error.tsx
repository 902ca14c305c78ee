"use client";
// The last resort: the root layout itself failed, so this draws its own <html> and cannot rely
// on the app's stylesheet or fonts (inline styles only).
export default function GlobalError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body style={{ fontFamily: "system-ui, sans-serif", margin: 0, background: "#f6f6f3", color: "#1c1e21" }}>
        <main role="alert" style={{ maxWidth: 560, margin: "0 auto", padding: "64px 24px" }}>
          <h1 style={{ fontSize: 20, fontWeight: 600 }}>Sensewright could not start this page</h1>
          <p style={{ color: "#52565c" }}>
            Something went wrong on the server; nothing you saved was changed. Try again in a moment.
          </p>
          {error.digest ? <p style={{ fontSize: 12, color: "#80848a" }}>Reference: {error.digest}</p> : null}
          <button
            type="button"
            onClick={reset}
            style={{
              marginTop: 8,
              padding: "6px 12px",
              border: "1px solid #b0602c",
              borderRadius: 4,
              background: "#b0602c",
              color: "#fff",
              font: "inherit",
              cursor: "pointer",
            }}
          >
            Try again
          </button>
        </main>
      </body>
    </html>
  );
}
