// ASVS 4.0.3 V5.1.5: redirects go only to allowed destinations — here, paths on the app's own
// origin. The vectors are the ones the WHATWG URL Standard's parser turns into another host
// (backslash as a slash in special schemes, tab/newline stripping, scheme-relative "//").
import { describe, expect, it } from "vitest";
import { safeCallbackPath } from "@/lib/auth/callback-url";

const ORIGIN = "https://loopkeeper.example.test";

describe("ASVS 5.1.5 — sign-in callback addresses", () => {
  it.each([
    "/\\evil.example/x",
    "/\t/evil.example",
    "/%09/evil.example".replace("%09", "\t"),
    "//evil.example",
    "\\\\evil.example",
    "https://evil.example/",
    "javascript:alert(1)",
    "/\n/evil.example",
    " //evil.example",
  ])("refuses %j", (raw) => {
    const path = safeCallbackPath(raw, ORIGIN);
    expect(path).toBe("/");
    // Whatever comes back, resolved as a browser would, stays on our origin.
    expect(new URL(path, ORIGIN).origin).toBe(ORIGIN);
  });

  it.each([
    ["/builds/42?tab=reviews", "/builds/42?tab=reviews"],
    ["/profiles#top", "/profiles#top"],
    [`${ORIGIN}/lots`, "/lots"],
    ["/.//evil.example", "/evil.example"],
    // Same scheme without slashes is a relative path to the parser (and to the browser).
    ["https:evil.example", "/evil.example"],
  ])("keeps same-origin path %j as %j", (raw, expected) => {
    const path = safeCallbackPath(raw, ORIGIN);
    expect(path).toBe(expected);
    expect(new URL(path, ORIGIN).origin).toBe(ORIGIN);
  });
});
