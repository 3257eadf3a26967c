import "server-only";
import { forbidden, notFound } from "next/navigation";
import { AppError } from "@/lib/errors";

/** For pages: turns the services' 404 and 403 errors into the framework's not-found and forbidden pages. */
export async function pageGuard<T>(work: Promise<T>): Promise<T> {
  try {
    return await work;
  } catch (error) {
    if (error instanceof AppError && error.code === "not_found") notFound();
    if (error instanceof AppError && error.code === "forbidden") forbidden();
    throw error;
  }
}
