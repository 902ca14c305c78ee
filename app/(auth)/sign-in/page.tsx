import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/auth/sign-in-form";
import { Logo } from "@/components/logo";
import { DEMO_ACCOUNTS, DEMO_PASSWORD, demoLoaded } from "@/db/seed";
import { currentCaller } from "@/lib/auth/gate";
import { safeNextPath } from "@/lib/auth/safe-redirect";

export const metadata: Metadata = { title: "Sign in" };
export const dynamic = "force-dynamic";

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string | string[] }> }) {
  const { next: raw } = await searchParams;
  // Only a path on this app: "/\evil.example" and the like fall back to the designs list.
  const next = safeNextPath(typeof raw === "string" ? raw : undefined);
  if (await currentCaller()) redirect(next);
  const showDemo = await demoLoaded();
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center gap-6 px-6 py-10">
      <div className="flex items-center gap-2 text-lg font-semibold">
        <Logo className="h-6 w-6" /> Sensewright
      </div>
      <div className="rounded-panel border border-line bg-panel p-6">
        <h1 className="mb-4 text-base font-semibold">Sign in to your team</h1>
        {next.startsWith("/invitations/") && (
          <p className="-mt-2 mb-4 text-xs text-ink-muted" data-testid="sign-in-for-invitation">
            An account with the invited e-mail exists: sign in as it, and you will come back to the invitation to join.
          </p>
        )}
        <SignInForm next={next} />
      </div>
      {showDemo && (
        <section aria-labelledby="demo-heading" className="rounded-panel border border-line bg-sunken p-4 text-xs">
          <h2 id="demo-heading" className="mb-2 font-semibold">
            Demo team: Harbourline Labs
          </h2>
          <p className="mb-2 text-ink-muted">
            Every demo account uses the password <code className="font-mono text-ink">{DEMO_PASSWORD}</code>.
          </p>
          <ul className="grid gap-1">
            {DEMO_ACCOUNTS.map((a) => (
              <li key={a.email} className="flex justify-between gap-2">
                <code className="font-mono">{a.email}</code>
                <span className="text-ink-muted">{a.role}</span>
              </li>
            ))}
          </ul>
        </section>
      )}
    </main>
  );
}
