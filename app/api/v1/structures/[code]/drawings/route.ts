import { apiRoute, json } from "@/lib/api/http";
import { readUpload } from "@/lib/api/uploads";
import { listDrawings, uploadDrawing } from "@/lib/services/files";

type Params = { code: string };

export const GET = apiRoute<Params>(async ({ actor, params }) => json({ drawings: await listDrawings(actor, params.code) }));

/** multipart/form-data: `file` (PNG, JPEG or WebP, at most 20 MB) and `title`. */
export const POST = apiRoute<Params>(async ({ request, actor, params }) =>
  json(await uploadDrawing(actor, params.code, await readUpload(request, "drawing")), 201),
);

export * from "@/lib/api/method-not-allowed";
