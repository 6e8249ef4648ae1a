import express from 'express';
import pg from 'pg';

// The floor the signed-in routes are measured against: a bare Express 5 app with one PostgreSQL query per request
// (the current materials, id and name), on the same database, pool size and machine. Nothing else: no session, no
// logging, no security headers. Run by tests/bench/signed-in-path.ts in a process of its own.
const pool = new pg.Pool({ connectionString: process.env['DATABASE_URL'], max: 10 });
const app = express();
app.get('/floor', async (_req, res) => {
  const { rows } = await pool.query('select id, name from materials where current and not retired order by name');
  res.json({ materials: rows });
});
app.get('/bare', (_req, res) => {
  res.json({ status: 'ok' });
});
const server = app.listen(Number(process.env['PORT']), '127.0.0.1');
process.on('SIGTERM', () => server.close(() => void pool.end()));
