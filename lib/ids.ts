// Ids in URLs are UUIDs (the database makes them): anything else names nothing, answers 404 and
// never reaches SQL. zod's uuid check, so the rule is the library's, not a regex of our own.
import { z } from "zod";

const uuid = z.uuid();

export const isUuid = (id: string): boolean => uuid.safeParse(id).success;
