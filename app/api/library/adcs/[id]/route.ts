import { apiRoute } from "@/lib/auth/gate";
import { readoutPart } from "@/lib/library/readout-routes";

const part = readoutPart("adcs");

export const PATCH = apiRoute(
  { action: "library.edit", doing: "edit the parts library", body: part.patch },
  part.update,
);
export const DELETE = apiRoute({ action: "library.edit", doing: "remove parts from the library" }, part.remove);
