import { notFound } from "next/navigation";
import { isAppError } from "@/lib/errors";

/** A service's not_found (including team blocks the reader may not see) becomes the segment's not-found page. */
export async function orNotFound<T>(work: Promise<T>): Promise<T> {
  try {
    return await work;
  } catch (err) {
    if (isAppError(err) && err.code === "not_found") notFound();
    throw err;
  }
}
