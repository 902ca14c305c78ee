import type { Metadata } from "next";
import { PasswordForm } from "@/components/account/password-form";
import { ProfileForm } from "@/components/account/profile-form";
import { TokensSection } from "@/components/account/tokens-section";
import { Panel } from "@/components/ui/panel";
import { listTokens } from "@/db/queries/tokens";
import { getAccount, listTeamsOf } from "@/db/queries/users";
import { requirePageCaller } from "@/lib/auth/gate";

export const metadata: Metadata = { title: "Account" };

export default async function AccountPage() {
  const caller = await requirePageCaller("/account");
  const [account, teams, tokens] = await Promise.all([
    getAccount(caller.userId),
    listTeamsOf(caller.userId),
    listTokens(caller.userId),
  ]);
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-lg font-semibold">Account</h1>
        <p className="text-ink-muted">
          Signed in as <span className="text-ink">{caller.email}</span>, a member of{" "}
          {teams.map((t, i) => (
            <span key={t.id}>
              {i > 0 && (i === teams.length - 1 ? " and " : ", ")}
              {t.name} ({t.role})
            </span>
          ))}
          .
        </p>
      </div>
      <div className="grid gap-4 lg:grid-cols-2">
        <Panel title="Name and review mail">
          <ProfileForm
            name={account?.user.name ?? caller.name}
            mail={account?.mail ?? { submitted: true, returned: true, approved: true, comments: true }}
          />
        </Panel>
        <Panel title="Password">
          <PasswordForm />
        </Panel>
      </div>
      <Panel title="API tokens">
        <TokensSection
          teamName={caller.teamName}
          tokens={tokens.map((t) => ({
            ...t,
            createdAt: t.createdAt.toISOString(),
            expiresAt: t.expiresAt?.toISOString() ?? null,
            lastUsedAt: t.lastUsedAt?.toISOString() ?? null,
          }))}
        />
      </Panel>
    </div>
  );
}
