// The client's build output under /assets: every file name carries a hash of its content (Vite), so a
// browser may keep it for a year without asking again, and a new build is new names. JavaScript, CSS
// and SVG go out gzip'd to browsers that accept it — compressed once per file on first request and kept
// in memory (a build is ~1 MB gzip'd) — because on a field tablet's slow link the uncompressed entry
// chunk alone took seconds. Node's zlib only: no compression package is installed.
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { gzip } from 'node:zlib';
import { promisify } from 'node:util';
import express, { type RequestHandler } from 'express';

const gzipAsync = promisify(gzip);
const COMPRESSIBLE = /^[\w.-]+\.(js|css|svg|json|webmanifest)$/;
const YEAR_SECONDS = 365 * 24 * 3600;

/** Serves `dir` (dist/assets) as immutable, gzip'd where it pays; anything else falls through to a plain static server with the same caching. */
export function builtAssets(dir: string): RequestHandler[] {
  const compressed = new Map<string, Promise<Buffer | null>>();
  const gzipped = (name: string) => {
    let found = compressed.get(name);
    if (!found) {
      found = readFile(path.join(dir, name)).then(
        (bytes) => gzipAsync(bytes, { level: 9 }),
        () => null,
      );
      compressed.set(name, found);
      // A file missing now may be written by a build later: forget the miss.
      void found.then((bytes) => bytes ?? compressed.delete(name));
    }
    return found;
  };
  const compressing: RequestHandler = (req, res, next) => {
    const name = req.path.slice(1);
    if ((req.method !== 'GET' && req.method !== 'HEAD') || !COMPRESSIBLE.test(name) || !req.acceptsEncodings('gzip')) return next();
    gzipped(name).then((bytes) => {
      if (!bytes) return next();
      res.vary('Accept-Encoding');
      res.type(path.extname(name));
      res.set({ 'Content-Encoding': 'gzip', 'Content-Length': String(bytes.length), 'Cache-Control': `public, max-age=${YEAR_SECONDS}, immutable` });
      res.end(req.method === 'HEAD' ? undefined : bytes);
    }, next);
  };
  return [compressing, express.static(dir, { index: false, maxAge: YEAR_SECONDS * 1000, immutable: true })];
}
