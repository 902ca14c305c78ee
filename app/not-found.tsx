// Any path the app has no page for (and any notFound() a page calls) answers HTTP 404 with this.
import type { Metadata } from "next";
import Link from "next/link";
import { Logo } from "@/components/logo";
import { buttonClass } from "@/components/ui/button";

export const metadata: Metadata = { title: "Not found" };

export default function NotFound() {
  return (
    <main className="mx-auto flex min-h-screen max-w-xl flex-col justify-center gap-4 px-6">
      <div className="flex items-center gap-2 font-semibold">
        <Logo className="h-6 w-6" /> Sensewright
      </div>
      <h1 className="text-xl font-semibold">Nothing here</h1>
      <p className="text-ink-muted">
        This address has no page, or what it pointed to is not yours to see. Saved designs are listed under Designs.
      </p>
      <div>
        <Link href="/designs" className={buttonClass("primary")}>
          Go to Designs
        </Link>
      </div>
    </main>
  );
}
