import { z } from "zod";
import { importParts } from "@/db/queries/library";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError, json } from "@/lib/http";
import { parseLibraryCsv } from "@/lib/library/csv";
import { readCsvUpload } from "@/lib/read-upload";
import { libraryKindSchema } from "@/lib/route-schemas";

const MAX_LIBRARY_CSV_BYTES = 2_000_000;

/**
 * Imports a CSV of amplifiers, shunt families, ADCs or meter ranges, all or nothing: multipart with `file` and `kind`
 * (or `?kind=`). A part whose name is already in the library is updated; the rest are added.
 */
export const POST = apiRoute(
  { action: "library.edit", doing: "import parts into the library" },
  async ({ caller, request }) => {
    const upload = await readCsvUpload(request, MAX_LIBRARY_CSV_BYTES);
    const kind = libraryKindSchema.safeParse(
      upload.fields.kind ?? new URL(request.url).searchParams.get("kind") ?? undefined,
    );
    if (!kind.success)
      throw new HttpError(422, 'Say which list the file holds: kind "amplifiers", "shunts", "adcs" or "meters".', {
        kind: ['expected "amplifiers", "shunts", "adcs" or "meters"'],
      });
    const parsed = parseLibraryCsv(kind.data, upload.text);
    if (!parsed.ok) {
      const problems = parsed.problems ?? [];
      const many = problems.length > 1;
      return json(
        {
          ...parsed.refusal.toJson(),
          message: many
            ? `${problems.length}${parsed.stopped ? " or more" : ""} rows have problems (the first: ${parsed.refusal.message}). Nothing was imported.`
            : `${parsed.refusal.message}. Nothing was imported.`,
          ...(problems.length ? { problems: problems.map((p) => ({ ...p.place, message: p.message })) } : {}),
        },
        422,
      );
    }
    const result = await importParts(caller.teamId, parsed.parts, caller.userId);
    return { kind: kind.data, fileName: upload.fileName, ...result };
  },
);
