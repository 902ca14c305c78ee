// The designs list's place in the URL (`/designs?q=…&status=…&cursor=…`), read and written the same
// way by the page (first render on the server) and the table (TanStack Query in the browser).
import type { DesignStatus } from "@/db/schema";
import type { DesignRow, DesignsPage } from "@/lib/api-description/responses";

export const designStatuses: readonly DesignStatus[] = ["draft", "in-review", "approved", "returned"];

export type { DesignRow, DesignsPage };

export type ListParams = { q: string; status: DesignStatus | ""; cursor: string };

type Readable = { get(name: string): string | null } | Record<string, string | string[] | undefined>;

function read(source: Readable, name: string): string {
  const raw =
    typeof (source as { get?: unknown }).get === "function"
      ? (source as { get(name: string): string | null }).get(name)
      : (source as Record<string, string | string[] | undefined>)[name];
  return (Array.isArray(raw) ? raw[0] : raw) ?? "";
}

/** The list's parameters from URL search params; an unknown status reads as "any". */
export function readListParams(source: Readable): ListParams {
  const status = read(source, "status");
  return {
    q: read(source, "q").trim().slice(0, 200),
    status: (designStatuses as readonly string[]).includes(status) ? (status as DesignStatus) : "",
    cursor: read(source, "cursor").slice(0, 400),
  };
}

/** The query string for `params`, leaving out what is empty. */
export function listSearch(params: ListParams, extra: Record<string, string> = {}): string {
  const s = new URLSearchParams();
  if (params.q) s.set("q", params.q);
  if (params.status) s.set("status", params.status);
  if (params.cursor) s.set("cursor", params.cursor);
  for (const [k, v] of Object.entries(extra)) s.set(k, v);
  const text = s.toString();
  return text ? `?${text}` : "";
}
