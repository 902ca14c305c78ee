"use client";

import { signOut } from "next-auth/react";
import { Button } from "@/components/ui/button";

/** Signs out and comes back to sign-in, which returns to `next` (the invitation) afterwards. */
export function SwitchAccountButton({ next, label }: { next: string; label: string }) {
  return (
    <Button variant="primary" onClick={() => signOut({ callbackUrl: `/sign-in?next=${encodeURIComponent(next)}` })}>
      {label}
    </Button>
  );
}
