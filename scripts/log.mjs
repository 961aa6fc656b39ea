// Progress lines for the project's scripts: one prefix, errors on stderr with exit 1.
export function log(msg) {
  console.log(`\x1b[36m[loopkeeper]\x1b[0m ${msg}`);
}
export function fail(msg) {
  console.error(`\x1b[31m[loopkeeper] ${msg}\x1b[0m`);
  process.exit(1);
}
