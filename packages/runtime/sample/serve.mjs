// Serves the sample game from the package folder: node node_modules/treadle-runtime/sample/serve.mjs [port]
// three comes from the project you run it in (npm install three); the runtime is this package. Loopback only.
import http from 'node:http';
import fs from 'node:fs';
import path from 'node:path';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';

const root = path.dirname(path.dirname(fileURLToPath(import.meta.url)));
let threeRoot = null;
try {
  // three's exports do not list its package.json: find the folder above its entry point that holds it.
  threeRoot = path.dirname(createRequire(path.join(process.cwd(), 'package.json')).resolve('three'));
  while (!fs.existsSync(path.join(threeRoot, 'package.json')) && path.dirname(threeRoot) !== threeRoot) threeRoot = path.dirname(threeRoot);
} catch {
  console.error('three is not installed here: run `npm install three` in this folder, then start again.');
  process.exit(1);
}
const types = { '.html': 'text/html', '.js': 'text/javascript', '.mjs': 'text/javascript', '.css': 'text/css', '.json': 'application/json', '.glb': 'model/gltf-binary' };
const port = Number(process.argv[2] ?? 8090);

http
  .createServer((req, res) => {
    const url = decodeURIComponent(new URL(req.url, 'http://localhost').pathname);
    const [base, rest] = url.startsWith('/three/') ? [threeRoot, url.slice('/three/'.length)] : [root, url === '/' ? 'sample/index.html' : url.slice(1)];
    const file = path.resolve(base, rest);
    if (!file.startsWith(base + path.sep) || !fs.existsSync(file) || !fs.statSync(file).isFile()) {
      res.writeHead(404).end('not found');
      return;
    }
    res.writeHead(200, { 'Content-Type': types[path.extname(file)] ?? 'application/octet-stream' });
    fs.createReadStream(file).pipe(res);
  })
  .listen(port, '127.0.0.1', () => console.log(`sample game at http://localhost:${port}/sample/index.html (three ${JSON.parse(fs.readFileSync(path.join(threeRoot, 'package.json'), 'utf8')).version})`));
