import { errorResponse } from "@/lib/api/http";
import { AppError } from "@/lib/errors";

function unknownRoute(request: Request) {
  const { pathname } = new URL(request.url);
  return errorResponse(new AppError("not_found", `There is no ${request.method} ${pathname} in the API; see /api/v1/openapi.json.`));
}

export { unknownRoute as GET, unknownRoute as POST, unknownRoute as PUT, unknownRoute as PATCH, unknownRoute as DELETE };
