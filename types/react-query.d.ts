import type { AppError } from "@/lib/api/errors";

// Every query and mutation fails with the AppError the client call throws, so components
// read `error.message` and `error.issues` without casting.
declare module "@tanstack/react-query" {
  interface Register {
    defaultError: AppError;
  }
}
