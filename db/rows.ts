import "server-only";

/**
 * The one row an INSERT or UPDATE … RETURNING of a single row answers. The caller just made or
 * locked that row, so none back is a fault to log, not a refusal to show.
 */
export async function returnedRow<T>(write: PromiseLike<T[]>): Promise<T> {
  const [row] = await write;
  if (!row) throw new Error("INSERT or UPDATE … RETURNING gave no row");
  return row;
}
