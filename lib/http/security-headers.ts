/**
 * The security headers of every response, in one place: next.config.ts sends the fixed ones with
 * every response (pages, API, static files, the framework's own refusals) and proxy.ts adds each
 * page's Content-Security-Policy with the nonce Next.js puts on its scripts. No imports: the
 * configuration file loads this module before anything is built.
 */

/** Pages may not be framed by anyone: a one-click button cannot be laid under a decoy. */
export const FIXED_SECURITY_HEADERS = [
  { key: "X-Frame-Options", value: "DENY" },
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "Referrer-Policy", value: "same-origin" },
] as const;

/** Only sent over HTTPS (as the server or the proxy in front of it saw the request). */
export const HSTS_HEADER = { key: "Strict-Transport-Security", value: "max-age=31536000; includeSubDomains" } as const;

/** API answers are data, never a document to run or frame. */
export const API_CSP = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

/**
 * A page's policy: only scripts carrying this response's nonce (and what they load, through
 * 'strict-dynamic'); styles from our own files and the style attributes the chart library sets;
 * images, fonts and data from our own origin. `unsafe-eval` only in development, where React
 * needs it to rebuild server error stacks.
 */
export function pageCsp(nonce: string, options: { development: boolean; https: boolean }): string {
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${options.development ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    ...(options.https ? ["upgrade-insecure-requests"] : []),
  ];
  return directives.join("; ");
}

/** A fresh, unguessable nonce for one response. */
export function newNonce(): string {
  return btoa(crypto.randomUUID());
}
