/** The load baseline: a bare Express endpoint returning a constant body of a given size. */
import express from 'express';

const size = Number(process.argv[2] ?? 1000);
const type = process.argv[3] ?? 'application/json';
const body = Buffer.alloc(size, 'x');
const app = express();
app.get('/bare', (_req, res) => {
  res.type(type).send(body);
});
const server = app.listen(0, '127.0.0.1', () => {
  const addr = server.address();
  process.stdout.write(`PORT ${typeof addr === 'object' && addr ? addr.port : 0}\n`);
});
