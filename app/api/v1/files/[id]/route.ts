import { apiRoute } from "@/lib/api/http";
import { parseWith } from "@/lib/validation";
import { fileId } from "@/lib/files/schema";
import { openFile, removeFile } from "@/lib/services/files";

type Params = { id: string };

/** The image bytes, served only as the type detected at upload and never sniffed into anything else. */
export const GET = apiRoute<Params>(async ({ actor, params }) => {
  const file = await openFile(actor, parseWith(fileId, params.id));
  return new Response(file.stream, {
    headers: {
      "content-type": file.contentType,
      "content-length": String(file.bytes),
      "x-content-type-options": "nosniff",
      "content-security-policy": "default-src 'none'; sandbox",
      "cache-control": "private, max-age=3600",
    },
  });
});

export const DELETE = apiRoute<Params>(async ({ actor, params }) => {
  await removeFile(actor, parseWith(fileId, params.id));
  return new Response(null, { status: 204 });
});

export * from "@/lib/api/method-not-allowed";
