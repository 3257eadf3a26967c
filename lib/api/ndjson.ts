import { AppError } from "@/lib/errors";
import { errorBody } from "./http";

/**
 * A response of newline-delimited JSON lines written while the work runs, for long requests
 * that report progress. The status is sent first, so a failure part-way arrives as a last
 * line `{ "type": "error", "error": { code, message } }` instead of a status.
 */
export function ndjsonResponse(work: (send: (line: Record<string, unknown>) => void) => Promise<void>): Response {
  const encoder = new TextEncoder();
  const body = new ReadableStream<Uint8Array>({
    async start(controller) {
      const send = (line: Record<string, unknown>) => controller.enqueue(encoder.encode(`${JSON.stringify(line)}\n`));
      try {
        await work(send);
      } catch (error) {
        if (!(error instanceof AppError)) console.error("Unexpected error in a streamed API response", error);
        const failure =
          error instanceof AppError
            ? errorBody(error)
            : { error: { code: "internal_error", message: "Something went wrong on the server; it has been logged." } };
        send({ type: "error", ...failure });
      }
      controller.close();
    },
  });
  // no-transform keeps the server's compression from holding progress lines back until the end.
  return new Response(body, { headers: { "content-type": "application/x-ndjson; charset=utf-8", "cache-control": "no-store, no-transform" } });
}
