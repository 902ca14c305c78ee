import { apiRoute } from "@/lib/auth/gate";
import { calibrationCsv } from "@/lib/built-units/csv";
import { unitsSummaryFor } from "@/lib/built-units/record";
import { attachment } from "@/lib/build-sheet/exports";
import { designSlug } from "@/lib/build-sheet/slug";

/** Each unit's gain and offset (corrected = gain · raw + offset_v) for a production line or firmware. */
export const GET = apiRoute({ action: "design.read", doing: "export calibrations" }, async ({ caller, params }) => {
  const { design, summary } = await unitsSummaryFor(caller, params.id ?? "");
  return new Response(calibrationCsv(summary.units), {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": attachment(`${designSlug(design.name)}-calibration.csv`),
    },
  });
});
