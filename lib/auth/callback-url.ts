import { unsafeTextReason } from "../validation/text";

/**
 * Where to send someone after sign-in: only a path on this app's own origin. The address is
 * parsed with the WHATWG URL parser against the app's origin (the same parser the browser
 * uses), so tricks such as "/\evil.example", "/%09/evil.example" or "https:evil.example"
 * resolve to another origin and are refused. Anything refused becomes "/".
 */
export function safeCallbackPath(raw: string | null | undefined, appOrigin: string): string {
  if (!raw || raw.length > 2000) return "/";
  // Browsers drop tabs and line breaks inside URLs, which turns "/\t/host" into "//host".
  if (unsafeTextReason(raw, { singleLine: true })) return "/";
  let origin: string;
  let url: URL;
  try {
    origin = new URL(appOrigin).origin;
    url = new URL(raw, origin);
  } catch {
    return "/";
  }
  if (url.origin !== origin) return "/";
  // A same-origin path that starts with "//" would be read as another host once used alone.
  const path = `/${url.pathname.replace(/^[/\\]+/, "")}`;
  return `${path}${url.search}${url.hash}`;
}
