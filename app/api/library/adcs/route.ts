import { readoutCollectionRoutes } from "@/lib/library/readout-routes";

export const { POST } = readoutCollectionRoutes("adcs");
