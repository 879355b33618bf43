// The demo consultancy's own website, on its own origin (default http://localhost:5181), with its
// widgets placed by their embed snippets exactly as a firm would paste them. The snippets come from
// the file the demo seed writes (var/demo-site.json).
import { createServer } from 'node:http';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { demoPage } from './lib/demo-page.mjs';

const port = Number(process.env.DEMO_SITE_PORT ?? 5181);
const root = new URL('..', import.meta.url).pathname;
const template = readFileSync(path.join(root, 'scripts', 'demo-site', 'index.html'), 'utf8');
const snippetsFile = process.env.DEMO_SITE_SNIPPETS ?? path.join(root, 'var', 'demo-site.json');

function page() {
  const { widgets } = JSON.parse(readFileSync(snippetsFile, 'utf8'));
  return demoPage(template, widgets);
}

const server = createServer((req, res) => {
  if (req.url === '/' || req.url === '/index.html') {
    res.writeHead(200, { 'content-type': 'text/html; charset=utf-8', 'cache-control': 'no-store' });
    res.end(page());
    return;
  }
  res.writeHead(404, { 'content-type': 'text/plain' });
  res.end('not found');
});
server.listen(port, '127.0.0.1', () => console.log(`demo consultancy site on http://localhost:${port}`));
const stop = () => server.close(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
