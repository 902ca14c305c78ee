import Link from "next/link";
import type { ReactNode } from "react";
import { Logo } from "@/components/logo";
import { NavLink } from "@/components/shell/nav-link";
import { SignOutButton } from "@/components/shell/sign-out-button";
import { TeamSwitcher } from "@/components/shell/team-switcher";
import { Badge } from "@/components/ui/badge";
import { listTeamsOf } from "@/db/queries/users";
import { requirePageCaller } from "@/lib/auth/gate";

export const dynamic = "force-dynamic";

export default async function WorkbenchLayout({ children }: { children: ReactNode }) {
  const caller = await requirePageCaller();
  const teams = await listTeamsOf(caller.userId);
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-line bg-panel">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-4 gap-y-1 px-4 py-2">
          <Link href="/designs" className="flex items-center gap-1.5 font-semibold">
            <Logo /> Sensewright
          </Link>
          <nav aria-label="Main" className="flex gap-1">
            <NavLink href="/designs">Designs</NavLink>
            <NavLink href="/meter">Meter check</NavLink>
            <NavLink href="/library">Library</NavLink>
            <NavLink href="/team">Team</NavLink>
          </nav>
          <div className="ml-auto flex items-center gap-3 text-xs">
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
          </div>
        </div>
      </header>
      <main className="mx-auto w-full max-w-7xl flex-1 px-4 py-6">{children}</main>
    </div>
  );
}
