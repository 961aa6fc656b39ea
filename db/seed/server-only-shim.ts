// The seed runs under tsx, outside Next's server build, where the `server-only` marker
// throws on import. Registering an empty module lets the seed call the same db/
// functions the app uses (so published versions are encoded and audited the same way).
const id = require.resolve("server-only");
require.cache[id] = { id, filename: id, loaded: true, exports: {} } as NodeJS.Module;

// Seeding writes many audit events; their log lines would drown the start-up progress.
process.env.LOOPKEEPER_LOG ??= "silent";
