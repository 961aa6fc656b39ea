import type { Operation } from "./operation";

/**
 * The TanStack Query key of an operation's answer: its id, then its path parameters and
 * query. The browser's queries and the server's first render (which hands its answers to
 * the browser's cache) derive the key the same way, so a page's first data is found there.
 * Screens may name the operation by its id alone: importing the operation object would
 * bring its zod schemas into pages that have no form.
 */
export function operationKey(op: Pick<Operation, "id"> | string, input: { params?: unknown; query?: unknown } = {}): readonly unknown[] {
  const key: unknown[] = [typeof op === "string" ? op : op.id];
  if (input.params !== undefined || input.query !== undefined) key.push(input.params ?? {});
  if (input.query !== undefined) key.push(input.query);
  return key;
}
