import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { JoinTeamButton } from "@/components/auth/join-team-button";
import { NewAccountForm } from "@/components/auth/new-account-form";
import { SwitchAccountButton } from "@/components/auth/switch-account-button";
import { Logo } from "@/components/logo";
import { findInvitationByToken } from "@/db/queries/invitations";
import { currentCaller } from "@/lib/auth/gate";
import { formatWhen } from "@/lib/saved-designs/when";

export const metadata: Metadata = { title: "Invitation" };
export const dynamic = "force-dynamic";

const why = {
  accepted: "This invitation has been used already. Sign in with the account it created.",
  revoked: "The team's owner revoked this invitation. Ask them for a new one if you still need access.",
  expired: "This invitation has expired. Ask the team's owner for a new one.",
} as const;

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = token.length >= 20 && token.length <= 200 ? await findInvitationByToken(token) : null;
  const here = `/invitations/${encodeURIComponent(token)}`;
  const caller = await currentCaller();
  const signedInAsInvitee = !!caller && !!invitation && caller.email.toLowerCase() === invitation.email.toLowerCase();
  // An existing account joins while signed in as itself: send a signed-out invitee to sign in first.
  if (invitation?.status === "pending" && invitation.hasAccount && !caller) {
    redirect(`/sign-in?next=${encodeURIComponent(here)}`);
  }
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center gap-6 px-6 py-10">
      <div className="flex items-center gap-2 text-lg font-semibold">
        <Logo className="h-6 w-6" /> Sensewright
      </div>
      <div className="rounded-panel border border-line bg-panel p-6">
        {!invitation ? (
          <>
            <h1 className="mb-2 text-base font-semibold">This invitation link is not valid</h1>
            <p className="text-ink-muted">
              Check that the whole link was copied from the mail, or ask the team&apos;s owner for a new one.
            </p>
          </>
        ) : invitation.status !== "pending" ? (
          <>
            <h1 className="mb-2 text-base font-semibold">Invitation to {invitation.teamName}</h1>
            <p className="text-ink-muted" data-testid="invitation-state">
              {why[invitation.status]}
            </p>
          </>
        ) : (
          <>
            <h1 className="mb-1 text-base font-semibold">Join {invitation.teamName}</h1>
            <p className="mb-4 text-xs text-ink-muted">
              You are invited as a <strong className="text-ink">{invitation.role}</strong>. The link works once and
              expires {formatWhen(invitation.expiresAt)}.
            </p>
            {!invitation.hasAccount ? (
              <NewAccountForm token={token} email={invitation.email} />
            ) : signedInAsInvitee && caller ? (
              <JoinTeamButton
                token={token}
                teamName={invitation.teamName}
                currentTeam={caller.teamName}
                email={caller.email}
              />
            ) : (
              <div className="flex flex-col gap-3" data-testid="wrong-account">
                <p>
                  This invitation is for <code className="font-mono">{invitation.email}</code>, and you are signed in as{" "}
                  <code className="font-mono">{caller?.email}</code>. Sign in as {invitation.email} to join; you will
                  come back to this page.
                </p>
                <SwitchAccountButton next={here} label={`Sign in as ${invitation.email}`} />
              </div>
            )}
          </>
        )}
      </div>
      {!caller && (
        <p className="text-center text-xs text-ink-muted">
          <Link href="/sign-in" className="hover:text-ink">
            Sign in instead
          </Link>
        </p>
      )}
    </main>
  );
}
