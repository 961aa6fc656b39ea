import { NextResponse } from "next/server";
import { allOperations } from "@/lib/api/operations";
import { buildOpenApi } from "@/lib/api/openapi";
import pkg from "@/package.json";

/** The OpenAPI document, generated from the same zod schemas the handlers parse with. */
export function GET() {
  return NextResponse.json(buildOpenApi(allOperations, pkg.version));
}
