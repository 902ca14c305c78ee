"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

export function NavLink({ href, children }: { href: string; children: string }) {
  const active = usePathname().startsWith(href);
  return (
    <Link
      href={href}
      aria-current={active ? "page" : undefined}
      className={`rounded px-2.5 py-1 text-sm ${active ? "bg-sunken font-medium text-ink" : "text-ink-muted hover:text-ink"}`}
    >
      {children}
    </Link>
  );
}
