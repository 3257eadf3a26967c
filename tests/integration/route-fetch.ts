/// <reference types="vite/client" />

/**
 * A `fetch` that answers /api/v1 requests with the app's own route handlers, found from the file
 * tree as Next finds them (static segments before `[param]`, `[...rest]` last), so a client library
 * can be pointed at the API without a server.
 */

type RouteModule = Record<string, unknown>;
type Handler = (request: Request, context: { params: Promise<Record<string, string | string[]>> }) => Promise<Response>;

const ROUTE_FILES = import.meta.glob<RouteModule>("/app/api/v1/**/route.ts");

type Route = { pattern: RegExp; load: () => Promise<RouteModule>; rank: number[]; catchAll: string[] };

const routes: Route[] = Object.entries(ROUTE_FILES)
  .map(([file, load]) => {
    const segments = file.replace(/^\/app\/api\/v1\//, "").replace(/\/?route\.ts$/, "").split("/").filter(Boolean);
    const source = segments
      .map((segment) => {
        const rest = /^\[\.\.\.(\w+)\]$/.exec(segment);
        if (rest) return `/(?<${rest[1]}>.+)`;
        const param = /^\[(\w+)\]$/.exec(segment);
        return param ? `/(?<${param[1]}>[^/]+)` : `/${segment.replace(/[.]/g, "\\.")}`;
      })
      .join("");
    const rank = segments.map((segment) => (segment.startsWith("[...") ? 2 : segment.startsWith("[") ? 1 : 0));
    const catchAll = segments.flatMap((segment) => /^\[\.\.\.(\w+)\]$/.exec(segment)?.[1] ?? []);
    return { pattern: new RegExp(`^${source}$`), load, rank, catchAll };
  })
  .sort((a, b) => compareRanks(a.rank, b.rank));

function compareRanks(a: number[], b: number[]) {
  for (let i = 0; i < Math.min(a.length, b.length); i++) if (a[i] !== b[i]) return a[i]! - b[i]!;
  return b.length - a.length;
}

export const routeFetch: typeof fetch = async (input, init) => {
  const request = new Request(input, init);
  const path = new URL(request.url).pathname.replace(/^\/api\/v1/, "");
  for (const route of routes) {
    const match = route.pattern.exec(path);
    if (!match) continue;
    const handler = (await route.load())[request.method];
    if (typeof handler !== "function") return new Response(null, { status: 405 });
    const params = Object.fromEntries(
      Object.entries(match.groups ?? {}).map(([name, value]) => [name, route.catchAll.includes(name) ? value.split("/").map(decodeURIComponent) : decodeURIComponent(value)]),
    );
    return (handler as Handler)(request, { params: Promise.resolve(params) });
  }
  return new Response(null, { status: 404 });
};
