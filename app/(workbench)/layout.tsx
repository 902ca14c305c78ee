import Link from "next/link";
import type { ReactNode } from "react";
import { SiteHeader } from "@/components/shell/site-header";
import { SignOutButton } from "@/components/shell/sign-out-button";
import { TeamSwitcher } from "@/components/shell/team-switcher";
import { Badge } from "@/components/ui/badge";
import { pageCallerTeams, requirePageCaller } from "@/lib/auth/gate";

export const dynamic = "force-dynamic";

export default async function WorkbenchLayout({ children }: { children: ReactNode }) {
  const caller = await requirePageCaller();
  const teams = await pageCallerTeams();
  return (
    <div className="flex min-h-screen flex-col">
      <SiteHeader
        account={
          <>
            <TeamSwitcher teams={teams} currentTeamId={caller.teamId} />
            <Link
              href="/account"
              className="font-medium hover:text-copper"
              data-testid="current-user"
              title="Your account"
            >
              {caller.name}
            </Link>
            <Badge tone="copper">
              <span data-testid="current-role">{caller.role}</span>
            </Badge>
            <SignOutButton />
          </>
        }
      />
      <main className="mx-auto w-full min-w-0 max-w-7xl flex-1 px-4 py-6">{children}</main>
    </div>
  );
}
