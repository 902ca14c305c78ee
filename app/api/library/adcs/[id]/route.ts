import { readoutItemRoutes } from "@/lib/library/readout-routes";

export const { PATCH, DELETE } = readoutItemRoutes("adcs");
