// Integration tests run against a real PostgreSQL: the test database that `npm test`
// prepares (scripts/test.mjs). Run alone, this starts the local cluster and migrates it.
import { execFileSync } from "node:child_process";

export default function setup() {
  if (!process.env.DATABASE_URL) {
    execFileSync("node", ["scripts/pg.mjs", "up", "loopkeeper_test"], { stdio: "inherit" });
    process.env.LOOPKEEPER_LOCAL_CLUSTER = "1";
    process.env.DATABASE_URL = execFileSync("node", ["scripts/pg.mjs", "url", "loopkeeper_test"], { encoding: "utf8" }).trim();
  }
  process.env.NEXTAUTH_SECRET ??= "integration-tests-secret-integration-tests-secret";
  execFileSync("npx", ["tsx", "db/migrate.ts"], { stdio: "inherit", env: process.env });
  execFileSync("npx", ["tsx", "db/seed/index.ts"], { stdio: "inherit", env: process.env });
}
