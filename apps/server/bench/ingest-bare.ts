// The baseline of the ingest benchmark: an Express 5 handler that takes the widget's report the
// way the embed API does (JSON sent as text/plain), parses it, answers as the API does, and stores
// nothing. Started by bench/ingest.ts on the port it is given (PORT).
import express from 'express';

const app = express();
app.disable('x-powered-by');
app.post(
  '/api/v1/embed/runs',
  express.text({ type: ['text/plain', 'application/json'], limit: '32kb' }),
  (req, res) => {
    const body = JSON.parse(req.body as string) as { id: string };
    res.status(201).json({ id: body.id, agreed: true, duplicate: false });
  },
);
const server = app.listen(Number(process.env.PORT), '127.0.0.1');
process.on('SIGTERM', () => server.close(() => process.exit(0)));
