import Link from "next/link";
import { redirect } from "next/navigation";
import { Logo } from "@/components/logo";
import { buttonClass } from "@/components/ui/button";
import { currentCaller } from "@/lib/auth/gate";

export const dynamic = "force-dynamic";

export default async function Landing() {
  if (await currentCaller()) redirect("/designs");
  return (
    <main className="mx-auto flex min-h-screen max-w-2xl flex-col justify-center gap-6 px-6">
      <div className="flex items-center gap-2 text-lg font-semibold">
        <Logo className="h-7 w-7" /> Sensewright
      </div>
      <h1 className="text-2xl font-semibold leading-snug">
        Measure a circuit&apos;s current without starving it of voltage.
      </h1>
      <p className="text-base text-ink-muted">
        Sensewright sweeps standard shunt values and amplifier gains against your current span, supply and readout, and
        shows each candidate&apos;s burden voltage, resolution, dissipation and error from the smallest current to the
        largest. Your team compares the alternatives, signs one off, and the bench gets a build sheet to assemble and
        check it.
      </p>
      <div>
        <Link href="/sign-in" className={buttonClass("primary")}>
          Sign in
        </Link>
      </div>
    </main>
  );
}
