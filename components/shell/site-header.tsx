"use client";
// The workbench header: the mark, the main navigation and who is signed in. Below the md
// breakpoint the navigation and account fold behind a "Menu" button so a 390 px phone never
// scrolls sideways; the menu closes when a page is chosen.
import Link from "next/link";
import { usePathname } from "next/navigation";
import { useEffect, useState, type ReactNode } from "react";
import { Logo } from "@/components/logo";
import { NavLink } from "./nav-link";

export function SiteHeader({ account }: { account: ReactNode }) {
  const [open, setOpen] = useState(false);
  const path = usePathname();
  // eslint-disable-next-line react-hooks/set-state-in-effect -- a new page closes the menu
  useEffect(() => setOpen(false), [path]);
  return (
    <header className="border-b border-line bg-panel">
      <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-4 gap-y-2 px-4 py-2">
        <Link href="/designs" className="flex items-center gap-1.5 font-semibold">
          <Logo /> Sensewright
        </Link>
        <button
          type="button"
          className="ml-auto rounded border border-line px-2.5 py-1 text-sm md:hidden"
          aria-expanded={open}
          aria-controls="site-menu"
          onClick={() => setOpen((o) => !o)}
        >
          {open ? "Close menu" : "Menu"}
        </button>
        <div
          id="site-menu"
          className={`${open ? "flex" : "hidden"} w-full flex-col gap-3 pb-2 md:flex md:w-auto md:flex-1 md:flex-row md:items-center md:pb-0`}
        >
          <nav aria-label="Main" className="flex flex-col gap-1 md:flex-row">
            <NavLink href="/designs">Designs</NavLink>
            <NavLink href="/meter">Meter check</NavLink>
            <NavLink href="/library">Library</NavLink>
            <NavLink href="/team">Team</NavLink>
          </nav>
          <div className="flex flex-wrap items-center gap-x-3 gap-y-1 text-xs md:ml-auto">{account}</div>
        </div>
      </div>
    </header>
  );
}
