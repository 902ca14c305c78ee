import { pingDatabase } from "@/db/queries/health";
import { publicRoute } from "@/lib/auth/gate";

export const dynamic = "force-dynamic";

export const GET = publicRoute(async () => ({ ok: true, database: await pingDatabase() }));
