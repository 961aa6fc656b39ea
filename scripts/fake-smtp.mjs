#!/usr/bin/env node
// The fake SMTP server as its own process, so a caller that blocks its event loop
// (spawnSync) cannot stall it. Prints {"port": n} once listening; stops on SIGTERM.
import { startFakeSmtp } from "./fakes.mjs";

const smtp = await startFakeSmtp({ databaseUrl: process.env.DATABASE_URL, port: Number(process.env.SMTP_PORT ?? 2525) });
process.stdout.write(`${JSON.stringify({ port: smtp.port })}\n`);
const stop = () => void smtp.stop().finally(() => process.exit(0));
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
