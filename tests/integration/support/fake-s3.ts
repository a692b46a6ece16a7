// A local stand-in for an S3-compatible store: path-style PUT and GET of objects, kept in memory.
// Enough for the AWS SDK's PutObject and GetObject; signatures are not checked.
import http from 'node:http';
import type { AddressInfo } from 'node:net';

export async function startFakeS3() {
  const objects = new Map<string, { body: Buffer; type: string }>();
  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      const key = decodeURIComponent(new URL(req.url!, 'http://x').pathname);
      if (req.method === 'PUT') {
        objects.set(key, { body: Buffer.concat(chunks), type: String(req.headers['content-type'] ?? 'application/octet-stream') });
        res.writeHead(200, { ETag: '"fake"' });
        res.end();
      } else if (req.method === 'GET' && objects.has(key)) {
        const object = objects.get(key)!;
        res.writeHead(200, { 'Content-Type': object.type, 'Content-Length': object.body.length });
        res.end(object.body);
      } else {
        res.writeHead(404, { 'Content-Type': 'application/xml' });
        res.end('<?xml version="1.0"?><Error><Code>NoSuchKey</Code><Message>not found</Message></Error>');
      }
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return {
    endpoint: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    objects,
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
