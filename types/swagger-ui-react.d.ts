// The package ships no types; this is the part of its props /api-docs uses.
declare module "swagger-ui-react" {
  import type { ComponentType } from "react";
  const SwaggerUI: ComponentType<{
    url?: string;
    spec?: object;
    docExpansion?: "list" | "full" | "none";
    defaultModelsExpandDepth?: number;
    tryItOutEnabled?: boolean;
    supportedSubmitMethods?: string[];
    deepLinking?: boolean;
  }>;
  export default SwaggerUI;
}
