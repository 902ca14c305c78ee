import { listLibrary } from "@/db/queries/library";
import { apiRoute } from "@/lib/auth/gate";

/** Every member reads the team's library. */
export const GET = apiRoute({ action: "library.read" }, async ({ caller }) => listLibrary(caller.teamId));
