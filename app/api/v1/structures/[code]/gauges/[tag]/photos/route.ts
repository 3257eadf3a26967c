import { apiRoute, json } from "@/lib/api/http";
import { readUpload } from "@/lib/api/uploads";
import { listGaugePhotos, uploadGaugePhoto } from "@/lib/services/files";

type Params = { code: string; tag: string };

export const GET = apiRoute<Params>(async ({ actor, params }) => json({ photos: await listGaugePhotos(actor, params.code, params.tag) }));

/** multipart/form-data: `file` (PNG, JPEG or WebP, at most 10 MB) and an optional `title`. */
export const POST = apiRoute<Params>(async ({ request, actor, params }) =>
  json(await uploadGaugePhoto(actor, params.code, params.tag, await readUpload(request, "photo")), 201),
);

export * from "@/lib/api/method-not-allowed";
