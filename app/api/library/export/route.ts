import { z } from "zod";
import { listLibrary } from "@/db/queries/library";
import { apiRoute } from "@/lib/auth/gate";
import { libraryToCsv } from "@/lib/library/csv";
import { partKinds } from "@/lib/library/schema";

/** `?kind=amplifiers|shunts` → text/csv with the API's field names as the header. */
export const GET = apiRoute(
  {
    action: "library.read",
    doing: "export the parts library",
    query: z.object({ kind: z.enum(partKinds, { error: 'kind: expected "amplifiers" or "shunts"' }) }),
  },
  async ({ caller, query }) => {
    const library = await listLibrary(caller.teamId);
    const csv = libraryToCsv(query.kind, query.kind === "amplifiers" ? library.amplifiers : library.shunts);
    return new Response(csv, {
      headers: {
        "content-type": "text/csv; charset=utf-8",
        "content-disposition": `attachment; filename="library-${query.kind}.csv"`,
        "cache-control": "no-store",
      },
    });
  },
);
