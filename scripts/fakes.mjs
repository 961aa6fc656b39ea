// Local stand-ins for hosted services, started beside the app on loopback.
// Mail: a fake SMTP server that stores every message it receives in local_mailbox,
// where admins read it on /admin/mailbox.
import { spawn } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";
import pg from "pg";
import { SMTPServer } from "smtp-server";
import { log } from "./log.mjs";

const MAX_MESSAGE_BYTES = 1024 * 1024;

/** The decoded value of one header of a raw message ("" when missing); folded lines joined. */
function header(raw, name) {
  const head = raw.split(/\r?\n\r?\n/, 1)[0] ?? "";
  const m = new RegExp(`^${name}:[ \\t]*(.*(?:\\r?\\n[ \\t].*)*)`, "im").exec(head);
  return m ? m[1].replace(/\r?\n[ \t]+/g, " ").trim() : "";
}

/** A fake SMTP server on 127.0.0.1:port writing to local_mailbox; port 0 picks a free one. */
export async function startFakeSmtp({ databaseUrl, port }) {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 2 });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, session, callback) {
      const chunks = [];
      let size = 0;
      stream.on("data", (c) => {
        size += c.length;
        if (size <= MAX_MESSAGE_BYTES) chunks.push(c);
      });
      stream.on("end", () => {
        if (stream.sizeExceeded || size > MAX_MESSAGE_BYTES) return callback(Object.assign(new Error("Message too large"), { responseCode: 552 }));
        const raw = Buffer.concat(chunks).toString("utf8");
        const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : "";
        const to = session.envelope.rcptTo.map((r) => r.address);
        pool
          .query("insert into local_mailbox (from_address, to_addresses, subject, raw) values ($1, $2, $3, $4)", [from, to, header(raw, "subject"), raw])
          .then(() => callback(), (err) => callback(Object.assign(new Error(`Mailbox unavailable: ${err.message}`), { responseCode: 451 })));
      });
    },
  });
  const actualPort = await new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => {
      server.off("error", reject);
      resolve(server.server.address().port);
    });
  });
  return {
    port: actualPort,
    stop: async () => {
      await new Promise((resolve) => server.close(() => resolve()));
      await pool.end();
    },
  };
}

/** Runs scripts/fake-smtp.mjs as a child process on `port` (0 = any free port); resolves with the port it got. */
function spawnFakeSmtp(env, port) {
  const child = spawn(process.execPath, [path.join(path.dirname(fileURLToPath(import.meta.url)), "fake-smtp.mjs")], {
    env: { ...env, SMTP_PORT: String(port) },
    stdio: ["ignore", "pipe", "pipe"],
  });
  return new Promise((resolve, reject) => {
    let out = "";
    let err = "";
    child.stderr.on("data", (c) => (err += c));
    child.stdout.on("data", (c) => {
      out += c;
      const line = out.split("\n")[0];
      if (out.includes("\n")) resolve({ child, port: JSON.parse(line).port });
    });
    child.once("exit", (code) => reject(Object.assign(new Error(`fake SMTP server exited (${code}): ${err.trim()}`), { code: /EADDRINUSE/.test(err) ? "EADDRINUSE" : undefined })));
  });
}

export async function startFakes(env) {
  const wanted = Number(env.SMTP_PORT || 2525);
  let smtp;
  try {
    smtp = await spawnFakeSmtp(env, wanted);
  } catch (err) {
    if (err?.code !== "EADDRINUSE") throw err;
    // Another checkout holds the usual port: take a free one and tell the app.
    smtp = await spawnFakeSmtp(env, 0);
  }
  log(`Fake SMTP server on 127.0.0.1:${smtp.port} (messages appear on /admin/mailbox).`);
  const stop = async () => {
    if (smtp.child.exitCode !== null) return;
    const exited = new Promise((resolve) => smtp.child.once("exit", resolve));
    smtp.child.kill("SIGTERM");
    await exited;
  };
  return { env: { SMTP_HOST: "127.0.0.1", SMTP_PORT: String(smtp.port) }, stop };
}
