// A minimal static file server for the browser tests: serves a built exhibit
// folder under a base path, as any static host would. Usage: node serve.mjs DIR PORT [BASE]
import { createServer } from 'node:http';
import { readFile, stat } from 'node:fs/promises';
import { extname, join, normalize } from 'node:path';

const [dir, port = '4321', base = '/'] = process.argv.slice(2);
const types = {
  '.html': 'text/html; charset=utf-8',
  '.css': 'text/css',
  '.js': 'text/javascript',
  '.json': 'application/json',
  '.csv': 'text/csv; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.woff2': 'font/woff2',
  '.woff': 'font/woff',
  '.pdf': 'application/pdf',
};

createServer(async (req, res) => {
  const url = new URL(req.url ?? '/', 'http://localhost');
  let path = decodeURIComponent(url.pathname);
  if (!path.startsWith(base)) {
    res.writeHead(404).end('not found');
    return;
  }
  path = normalize(path.slice(base.length - 1)).replace(/^(\.\.[/\\])+/, '');
  let file = join(dir, path);
  try {
    if ((await stat(file)).isDirectory()) file = join(file, 'index.html');
    const body = await readFile(file);
    res.writeHead(200, { 'Content-Type': types[extname(file)] ?? 'application/octet-stream' }).end(body);
  } catch {
    res.writeHead(404, { 'Content-Type': 'text/plain' }).end('not found');
  }
}).listen(Number(port), '127.0.0.1', () => console.log(`serving ${dir} at http://127.0.0.1:${port}${base}`));
