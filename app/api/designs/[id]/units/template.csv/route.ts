import { apiRoute } from "@/lib/auth/gate";
import { unitsCsvTemplate } from "@/lib/built-units/csv";
import { referenceRevision } from "@/lib/built-units/judge";
import { benchOf, unitsContext } from "@/lib/built-units/record";
import { attachment } from "@/lib/build-sheet/exports";
import { designSlug } from "@/lib/build-sheet/slug";

/** A blank import file: the header the units import reads, for the newest approved revision. */
export const GET = apiRoute({ action: "design.read", doing: "read built units" }, async ({ caller, params }) => {
  const { design, revisions } = await unitsContext(caller, params.id ?? "");
  const ref = referenceRevision(revisions);
  return new Response(unitsCsvTemplate(ref ? benchOf(ref) : []), {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": attachment(`${designSlug(design.name)}-units.csv`),
    },
  });
});
