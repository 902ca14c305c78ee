import "@/lib/design/zod-jitless";
import { z } from "zod";
import { roles } from "@/db/schema";

export const roleSchema = z.enum(roles, { message: `Role must be one of: ${roles.join(", ")}` });
export const roleChangeSchema = z.object({ role: roleSchema });
