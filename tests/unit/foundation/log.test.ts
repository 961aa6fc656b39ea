import { Writable } from "node:stream";
import { describe, expect, it } from "vitest";
import { createLogger } from "@/lib/platform/log";

describe("structured logs", () => {
  it("writes JSON lines with the request id and redacts secrets", () => {
    const lines: string[] = [];
    const sink = new Writable({
      write(chunk: Buffer, _enc, done) {
        lines.push(chunk.toString());
        done();
      },
    });
    const log = createLogger(sink, "info");
    log.info({ requestId: "r-1", authorization: "Bearer lk_secret", headers: { cookie: "next-auth.session-token=abc" }, body: { password: "hunter2-hunter2" } }, "request");
    const entry = JSON.parse(lines[0]!) as Record<string, unknown>;
    expect(entry).toMatchObject({ requestId: "r-1", msg: "request", authorization: "[redacted]", headers: { cookie: "[redacted]" }, body: { password: "[redacted]" } });
    expect(lines.join("")).not.toMatch(/lk_secret|hunter2|session-token=abc/);
  });
});
