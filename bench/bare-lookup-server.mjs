// The bare baseline for `npm run bench:lookup`: node:http + pg, the same lot query as
// the app's hot path (db/lookup.ts) as a named prepared statement, no framework.
import http from "node:http";
import pg from "pg";

const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: Number(process.env.DB_POOL_MAX ?? 10) });
const SQL = `select lot.id, lot.lot_code, lot.serial_from, lot.serial_to, lot.produced_on, lot.line,
    r.revision, b.id as build_id, b.version, b.stage, b.withdrawn_reason
  from (select id, lot_code, board_revision_id, build_id, serial_from, serial_to, produced_on, line
          from production_lots
         where board_model_id = (select id from board_models where serial_prefix = $1) and serial_from <= $2
         order by serial_from desc limit 1) lot
  join board_revisions r on r.id = lot.board_revision_id
  join builds b on b.id = lot.build_id`;
const SERIAL = /^([A-Za-z][A-Za-z0-9]{1,7})-(\d{1,8})$/;

const server = http.createServer(async (req, res) => {
  const url = new URL(req.url ?? "/", "http://127.0.0.1");
  const m = SERIAL.exec((url.searchParams.get("serial") ?? "").trim());
  if (!m) {
    res.writeHead(400, { "content-type": "application/json" }).end('{"error":"not a serial number"}');
    return;
  }
  try {
    const serial = Number(m[2]);
    const { rows } = await pool.query({ name: "bare_lot_by_serial", text: SQL, values: [m[1].toUpperCase(), serial] });
    const lot = rows[0];
    if (!lot || Number(lot.serial_to) < serial) {
      res.writeHead(404, { "content-type": "application/json" }).end('{"error":"not found"}');
      return;
    }
    res.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify(lot));
  } catch (err) {
    res.writeHead(500, { "content-type": "application/json" }).end(JSON.stringify({ error: String(err) }));
  }
});
server.keepAliveTimeout = 65_000;
server.listen(Number(process.env.PORT), "127.0.0.1", () => process.send?.("ready"));
