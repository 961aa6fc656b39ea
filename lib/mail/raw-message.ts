/** Headers and text body of a raw RFC 5322 message, for showing the local mailbox. */
export function messageBodyText(raw: string): string {
  const split = raw.search(/\r?\n\r?\n/);
  if (split < 0) return "";
  const headers = raw.slice(0, split);
  let body = raw.slice(split).replace(/^\r?\n\r?\n/, "");
  const encoding = /^content-transfer-encoding:\s*(\S+)/im.exec(headers)?.[1]?.toLowerCase();
  if (encoding === "quoted-printable") {
    // RFC 2045 §6.7: "=" at line end is a soft break; "=XX" is a byte.
    const bytes = body.replace(/=\r?\n/g, "").replace(/=([0-9A-F]{2})/gi, (_, h: string) => String.fromCharCode(parseInt(h, 16)));
    body = utf8(bytes);
  } else if (encoding === "base64") {
    body = utf8(atob(body.replace(/\s+/g, "")));
  }
  return body.replace(/\r\n/g, "\n").trimEnd();
}

/** A string of byte values (one char per byte) decoded as UTF-8. */
function utf8(byteString: string): string {
  return new TextDecoder().decode(Uint8Array.from(byteString, (c) => c.charCodeAt(0)));
}
