"use client";
// A page that failed while rendering: say so plainly and offer a retry. The server has logged the
// error; `digest` ties this screen to that log line.
import Link from "next/link";
import { Button, buttonClass } from "@/components/ui/button";

export default function PageError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main className="mx-auto flex max-w-xl flex-col gap-4 px-6 py-16" role="alert">
      <h1 className="text-xl font-semibold">This page could not be shown</h1>
      <p className="text-ink-muted">
        Something went wrong on the server while drawing it; nothing you saved was changed. Try again, or go back to
        your designs.
      </p>
      {error.digest ? <p className="text-xs text-ink-faint">Reference: {error.digest}</p> : null}
      <div className="flex gap-2">
        <Button variant="primary" onClick={reset}>
          Try again
        </Button>
        <Link href="/designs" className={buttonClass("secondary")}>
          Designs
        </Link>
      </div>
    </main>
  );
}
