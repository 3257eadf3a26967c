import { allowedMethods } from "./route-rules";

/**
 * Every route file ends with `export * from "@/lib/api/method-not-allowed"`: the methods it
 * defines itself win over these, and every other method gets the contract's error body instead
 * of the framework's empty 405.
 */
function methodNotAllowed(request: Request): Response {
  const { pathname } = new URL(request.url);
  const allowed = allowedMethods(pathname);
  const message = `${pathname} does not answer ${request.method}; it answers ${allowed.join(", ")}.`;
  return Response.json(
    { error: { code: "method_not_allowed", message } },
    { status: 405, headers: { allow: allowed.join(", "), connection: "close" } },
  );
}

export { methodNotAllowed as GET, methodNotAllowed as POST, methodNotAllowed as PUT, methodNotAllowed as PATCH, methodNotAllowed as DELETE };
