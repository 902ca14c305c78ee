import { listLibrary } from "@/db/queries/library";
import { apiRoute } from "@/lib/auth/gate";
import { libraryToCsv } from "@/lib/library/csv";
import { libraryExportQuery } from "@/lib/route-schemas";

/** `?kind=amplifiers|shunts|adcs|meters` → text/csv with the API's field names as the header. */
export const GET = apiRoute(
  {
    action: "library.read",
    doing: "export the parts library",
    query: libraryExportQuery,
  },
  async ({ caller, query }) => {
    const library = await listLibrary(caller.teamId);
    const csv = libraryToCsv(query.kind, library[query.kind]);
    return new Response(csv, {
      headers: {
        "content-type": "text/csv; charset=utf-8",
        "content-disposition": `attachment; filename="library-${query.kind}.csv"`,
        "cache-control": "no-store",
      },
    });
  },
);
