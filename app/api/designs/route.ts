import { z } from "zod";
import { designStatusEnum } from "@/db/schema";
import { apiRoute } from "@/lib/auth/gate";
import { HttpError, json } from "@/lib/http";
import { decodeListCursor } from "@/lib/saved-designs/list-cursor";
import { designsListPage } from "@/lib/saved-designs/list-page";
import { idempotencyKeyOf, saveNewDesign } from "@/lib/saved-designs/create";
import { createDesignSchema } from "@/lib/saved-designs/service";

const listQuery = z.object({
  limit: z.coerce
    .number({ error: "limit must be a whole number from 1 to 200" })
    .int("limit must be a whole number from 1 to 200")
    .min(1, "limit must be at least 1")
    .max(200, "limit must be at most 200")
    .default(50),
  cursor: z.string().max(400, "cursor is not one this list gave out").optional(),
  q: z.string().trim().max(200, "q must be at most 200 characters").optional(),
  status: z
    .enum(designStatusEnum.enumValues, { error: `status must be one of ${designStatusEnum.enumValues.join(", ")}` })
    .optional(),
});

// Paged newest change first (API v2): {designs, nextCursor}; makers page approved designs only.
export const GET = apiRoute(
  { action: "design.read", doing: "list designs", query: listQuery },
  async ({ caller, query }) => {
    const after = query.cursor ? decodeListCursor(caller.teamId, query.cursor) : undefined;
    if (after === null) {
      throw new HttpError(422, "Invalid input at cursor: it was not given out by this team's designs list.", {
        cursor: ["was not given out by this team's designs list; start again without a cursor"],
      });
    }
    return designsListPage(caller, {
      status: query.status,
      q: query.q || undefined,
      limit: query.limit,
      after,
    });
  },
);

export const POST = apiRoute(
  { action: "design.create", body: createDesignSchema },
  async ({ caller, body, request }) => {
    // A repeat with the same Idempotency-Key answers as the first time (201, same id) and creates nothing.
    return json(await saveNewDesign(caller, body, idempotencyKeyOf(request)), 201);
  },
);
