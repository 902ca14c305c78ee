import type { Metadata } from "next";
import Link from "next/link";
import { ApiReference } from "@/components/api-docs/api-reference";
import { requirePageCaller } from "@/lib/auth/gate";

export const metadata: Metadata = { title: "API reference" };

export default async function ApiDocsPage() {
  await requirePageCaller("/api-docs");
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-lg font-semibold">API reference</h1>
        <p className="max-w-prose text-ink-muted">
          Every route of the HTTP API, generated from the same schemas the server checks requests with (
          <a href="/api/openapi.json" className="text-copper hover:underline">
            /api/openapi.json
          </a>
          , OpenAPI 3.1). Numbers are SI base units with the unit in the field name. Scripts authenticate with a
          personal token from your{" "}
          <Link href="/account" className="text-copper hover:underline">
            account
          </Link>
          .
        </p>
      </div>
      <ApiReference />
    </div>
  );
}
