// The recording form's validation: the built-unit schema reads each reading with the engine's unit
// parser (mathjs), so this module is loaded when the form is first used, not with the design page.
import { zodResolver } from "@hookform/resolvers/zod";
import { recordUnitSchema } from "@/lib/built-units/schemas";

export const recordUnitResolver = zodResolver(recordUnitSchema);
