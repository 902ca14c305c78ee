import { insertUnits } from "@/db/queries/units";
import { apiRoute } from "@/lib/auth/gate";
import { MAX_UNITS_CSV_BYTES, parseUnitsCsv } from "@/lib/built-units/csv";
import { benchOf, buildRevision, readingsToStore, unitsContext } from "@/lib/built-units/record";
import { HttpError, json } from "@/lib/http";
import { readCsvUpload } from "@/lib/read-upload";

/**
 * Many units from one CSV (multipart, field `file`; optional field `revision`): a header of `serial`,
 * optional `date`, and one column per test point (its name or its current). All or nothing: a refusal
 * is 422 naming the row and column, and nothing is stored.
 */
export const POST = apiRoute(
  { action: "unit.record", doing: "import built units" },
  async ({ caller, params, request }) => {
    const { design, revisions } = await unitsContext(caller, params.id ?? "");
    const upload = await readCsvUpload(request, MAX_UNITS_CSV_BYTES);
    const askedText = upload.fields.revision?.trim();
    const asked = askedText ? Number(askedText) : undefined;
    if (asked !== undefined && !(Number.isInteger(asked) && asked >= 1))
      throw new HttpError(422, `revision: "${askedText}" is not a revision number.`, {
        revision: ["expected a whole number"],
      });
    const basis = buildRevision(design, revisions, asked);
    const bench = benchOf(basis);
    const parsed = parseUnitsCsv(upload.text, bench);
    if (!parsed.ok) {
      const body = parsed.refusal.toJson();
      return json({ ...body, message: `${body.message}. Nothing was stored.` }, 422);
    }
    const units = parsed.units.map((u) => ({
      serial: u.serial,
      revision: basis.revision,
      builtOn: u.builtOn,
      readings: readingsToStore(bench, u.readings),
    }));
    const written = await insertUnits({
      teamId: caller.teamId,
      designId: design.id,
      actorId: caller.userId,
      source: "csv",
      units,
    });
    if (!written.ok) {
      if (written.reason === "not-found") throw new HttpError(404, "That design was not found in your team.");
      const row = parsed.units[written.index]?.row;
      const message = `${row !== undefined ? `Data row ${row}, ` : ""}column "serial": "${written.serial}" is already recorded on this design. Nothing was stored.`;
      return json(
        { message, fieldErrors: { file: [message] }, ...(row !== undefined ? { row } : {}), column: "serial" },
        422,
      );
    }
    return json({ imported: written.ids.length, ids: written.ids, revision: basis.revision }, 201);
  },
);
