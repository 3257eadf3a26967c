import type { Metadata } from "next";
import { ApiReference } from "@/components/api-reference/api-reference";
import { PageHeader } from "@/components/ui/page-header";

export const metadata: Metadata = { title: "API reference" };

export default function ApiReferencePage() {
  return (
    <>
      <PageHeader
        title="API reference"
        subtitle={
          <>
            The machine API at <code>/api/v1</code>, for data loggers and scripts; authenticate with an API token as{" "}
            <code>Authorization: Bearer …</code>. The same document, for client generators: <a className="text-accent underline" href="/api/v1/openapi.json">/api/v1/openapi.json</a>.
          </>
        }
      />
      {/* The browser fetches the very document client generators get, instead of a 180 kB copy in the page. */}
      <ApiReference documentUrl="/api/v1/openapi.json" />
    </>
  );
}
