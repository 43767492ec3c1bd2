import "server-only";
import { notFound } from "next/navigation";
import { AppError } from "@/lib/domain/errors";

/**
 * For pages: `await getThing(...).catch(notFoundOnMissing)`. A record the lib says is missing (or
 * hidden from this user) renders the 404 page; anything else is thrown on.
 */
export function notFoundOnMissing(error: unknown): never {
  if (error instanceof AppError && error.code === "not_found") notFound();
  throw error;
}
