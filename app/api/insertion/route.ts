// POST /api/insertion: what a series resistance (a meter range, a shunt) does to the load.
import { InsertionError, insertion, insertionSchema } from "@/lib/design";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError } from "@/lib/http";

export const POST = apiRoute(
  { action: "engine.use", body: insertionSchema, doing: "check an insertion" },
  async ({ body }) => {
    try {
      return insertion(body);
    } catch (e) {
      if (e instanceof InsertionError) throw new HttpError(422, e.message, { [e.field]: [e.message] });
      throw e;
    }
  },
);
