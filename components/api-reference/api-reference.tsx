"use client";

import { useEffect, useRef, useState } from "react";
import "swagger-ui-dist/swagger-ui.css";

/**
 * The API's OpenAPI document drawn by Swagger UI, bundled with the app so that it works without
 * reaching any other site (no validator badge; the document is this app's own, built with it).
 */
export function ApiReference({ documentUrl }: { documentUrl: string }) {
  const container = useRef<HTMLDivElement>(null);
  const [state, setState] = useState<"loading" | "ready" | "failed">("loading");

  useEffect(() => {
    let cancelled = false;
    import("swagger-ui-dist/swagger-ui-es-bundle.js")
      .then(({ default: SwaggerUI }) => {
        if (cancelled || !container.current) return;
        SwaggerUI({
          domNode: container.current,
          url: documentUrl,
          validatorUrl: null,
          deepLinking: true,
          defaultModelsExpandDepth: 0,
          tryItOutEnabled: false,
          onComplete: () => setState("ready"),
        });
      })
      .catch(() => !cancelled && setState("failed"));
    return () => {
      cancelled = true;
    };
  }, [documentUrl]);

  return (
    <div className="rounded-lg border border-slate-200 bg-white dark:border-slate-700" data-state={state}>
      {state === "loading" && <p className="p-4 text-sm text-slate-600">Loading the reference…</p>}
      {state === "failed" && (
        <p role="alert" className="p-4 text-sm text-red-700">
          The reference could not be drawn. The document itself is at <a className="underline" href="/api/v1/openapi.json">/api/v1/openapi.json</a>.
        </p>
      )}
      <div ref={container} data-testid="api-reference" />
    </div>
  );
}
