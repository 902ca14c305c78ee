import { apiRoute } from "@/lib/auth/gate";
import { calibrationJson } from "@/lib/built-units/csv";
import { unitsSummaryFor } from "@/lib/built-units/record";
import { attachment } from "@/lib/build-sheet/exports";
import { designSlug } from "@/lib/build-sheet/slug";

/** The same coefficients as calibration.csv, as JSON. */
export const GET = apiRoute({ action: "design.read", doing: "export calibrations" }, async ({ caller, params }) => {
  const { design, summary } = await unitsSummaryFor(caller, params.id ?? "");
  return Response.json(calibrationJson({ id: design.id, name: design.name }, summary.units, new Date()), {
    headers: { "content-disposition": attachment(`${designSlug(design.name)}-calibration.json`) },
  });
});
