import { apiRoute } from "@/lib/auth/gate";
import { readoutPart } from "@/lib/library/readout-routes";

const part = readoutPart("adcs");

export const POST = apiRoute(
  { action: "library.edit", doing: "add parts to the library", body: part.input },
  part.create,
);
