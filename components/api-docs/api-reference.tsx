"use client";
// Renders /api/openapi.json with the open-source OpenAPI renderer from npm, loaded only on this
// page and only in the browser. "Try it out" calls go out with the session cookie.
import dynamic from "next/dynamic";
import "swagger-ui-react/swagger-ui.css";

const SwaggerUI = dynamic(() => import("swagger-ui-react"), {
  ssr: false,
  loading: () => <p className="p-4 text-sm text-ink-muted">Loading the API reference…</p>,
});

export function ApiReference() {
  return (
    <div
      data-testid="api-reference"
      className="api-reference rounded-panel border border-line bg-white [&_.swagger-ui]:font-sans [&_.swagger-ui_.info]:hidden [&_.swagger-ui_.scheme-container]:hidden"
    >
      <SwaggerUI url="/api/openapi.json" docExpansion="list" defaultModelsExpandDepth={-1} deepLinking />
    </div>
  );
}
