// The floor for the API benchmark: bare Express answering `select 1` from the
// same PostgreSQL, with nothing else. No request can cost less than this.
import express from 'express';
import pg from 'pg';

const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 10 });
pool.on('error', () => undefined);
const app = express();
app.get('/floor', async (_req, res) => {
  const { rows } = await pool.query('select 1 as one');
  res.json({ ok: rows[0].one === 1 });
});
const server = app.listen(Number(process.env.PORT), '127.0.0.1', () => {
  process.send?.('ready');
});
process.on('SIGTERM', () => {
  server.close();
  void pool.end().then(() => process.exit(0));
});
