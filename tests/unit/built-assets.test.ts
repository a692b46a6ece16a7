// The client's hashed build files: sent gzip'd to a browser that accepts it (the bytes unchanged once
// inflated), plain otherwise, and cacheable for a year either way since a new build has new names.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { builtAssets } from '../../server/lib/built-assets';

function appWithAssets() {
  const dir = mkdtempSync(path.join(tmpdir(), 'hotwell-assets-'));
  // Repetitive like real minified code, so gzip has something to do.
  const js = `export const a = ${JSON.stringify('condenser backpressure '.repeat(400))};\n`;
  writeFileSync(path.join(dir, 'index-Ab12Cd34.js'), js);
  writeFileSync(path.join(dir, 'font-Xy.woff2'), Buffer.from([0x77, 0x4f, 0x46, 0x32]));
  const app = express();
  app.use('/assets', ...builtAssets(dir));
  return { app, js };
}

describe('built assets', () => {
  it('sends JavaScript gzip’d, much smaller, and the same bytes once inflated, cacheable for a year', async () => {
    const { app, js } = appWithAssets();
    const res = await request(app).get('/assets/index-Ab12Cd34.js').set('Accept-Encoding', 'gzip, br');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers['vary']).toMatch(/Accept-Encoding/);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    // Content-Length is what went over the wire; supertest inflates the body as a browser would.
    expect(Number(res.headers['content-length'])).toBeLessThan(Buffer.byteLength(js) / 10);
    expect(res.text).toBe(js);
  });

  it('sends it plain to a client that does not accept gzip, still cacheable', async () => {
    const { app, js } = appWithAssets();
    const res = await request(app).get('/assets/index-Ab12Cd34.js').set('Accept-Encoding', 'identity');
    expect(res.status).toBe(200);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.text).toBe(js);
    expect(res.headers['cache-control']).toMatch(/max-age=31536000, immutable/);
  });

  it('leaves already-compressed files (fonts) as they are and passes on names it does not have', async () => {
    const { app } = appWithAssets();
    const font = await request(app).get('/assets/font-Xy.woff2').set('Accept-Encoding', 'gzip');
    expect(font.status).toBe(200);
    expect(font.headers['content-encoding']).toBeUndefined();
    expect((await request(app).get('/assets/missing-1234.js').set('Accept-Encoding', 'gzip')).status).toBe(404);
    expect((await request(app).get('/assets/..%2Fsecret.js').set('Accept-Encoding', 'gzip')).status).toBe(404);
  });
});
