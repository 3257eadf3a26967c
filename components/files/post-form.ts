/** What the API answered to a multipart form: the created thing, or its error message and the field it names. */
export type PostAnswer<T> = { ok: true; body: T } | { ok: false; message: string; field?: string };

/** Sends a form to an /api/v1 route with XMLHttpRequest, because fetch cannot report upload progress. */
export function postForm<T>(url: string, data: FormData, onProgress: (fraction: number) => void): Promise<PostAnswer<T>> {
  return new Promise((resolve) => {
    const request = new XMLHttpRequest();
    request.open("POST", url);
    request.responseType = "json";
    request.upload.onprogress = (event) => event.lengthComputable && onProgress(event.loaded / event.total);
    request.onload = () => {
      if (request.status === 201) return resolve({ ok: true, body: request.response as T });
      const error = (request.response as { error?: { message?: string; details?: { field?: string; issues?: { path: string }[] } } } | null)?.error;
      const field = error?.details?.field ?? error?.details?.issues?.[0]?.path;
      resolve({ ok: false, message: error?.message ?? `The server refused the upload (HTTP ${request.status}).`, ...(field ? { field } : {}) });
    };
    request.onerror = () => resolve({ ok: false, message: "The upload did not reach the server. Check the connection and try again." });
    request.send(data);
  });
}
