import type { ReactNode } from "react";
import { SiteHeader } from "@/components/shell/site-header";
import { SignOutButton } from "@/components/shell/sign-out-button";
import { Badge } from "@/components/ui/badge";
import { requirePageCaller } from "@/lib/auth/gate";

export const dynamic = "force-dynamic";

export default async function WorkbenchLayout({ children }: { children: ReactNode }) {
  const caller = await requirePageCaller();
  return (
    <div className="flex min-h-screen flex-col">
      <SiteHeader
        account={
          <>
            <span className="text-ink-muted">{caller.teamName}</span>
            <span className="font-medium" data-testid="current-user">
              {caller.name}
            </span>
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
