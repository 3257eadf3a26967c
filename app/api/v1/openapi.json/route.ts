import { openApiDocument } from "@/lib/api/openapi";

export const dynamic = "force-static";

export function GET() {
  return Response.json(openApiDocument());
}

export * from "@/lib/api/method-not-allowed";
