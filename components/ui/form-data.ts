/** The text value of a form field, or "" when it is missing or a file. */
export function formText(fd: FormData, key: string): string {
  const v = fd.get(key);
  return typeof v === "string" ? v : "";
}
