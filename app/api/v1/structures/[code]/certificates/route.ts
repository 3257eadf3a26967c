import { apiRoute, json } from "@/lib/api/http";
import { readUpload } from "@/lib/api/uploads";
import { addCertificate, listCertificates } from "@/lib/services/certificates";

type Params = { code: string };

export const GET = apiRoute<Params>(async ({ actor, params }) => json(await listCertificates(actor, params.code)));

/** multipart/form-data: `file` (PDF or image, at most 20 MB), `gauge` or `logger`, `number`, `issuedBy`, `issuedOn`, `expiresOn`. */
export const POST = apiRoute<Params>(async ({ request, actor, params }) =>
  json(await addCertificate(actor, params.code, await readUpload(request, "certificate")), 201),
);

export * from "@/lib/api/method-not-allowed";
