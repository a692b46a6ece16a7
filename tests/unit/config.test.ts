// The configuration check at start: every wrong or missing variable is named, with what it should be.
import { describe, expect, it } from 'vitest';
import { ConfigError, readConfig } from '../../server/config';

const minimal = { DATABASE_URL: 'mariadb://hotwell:pw@db.plant.example:3306/hotwell', SESSION_SECRET: 'dev-secret' };
const production = {
  ...minimal,
  NODE_ENV: 'production',
  SESSION_SECRET: 'a'.repeat(64),
  PUBLIC_URL: 'https://hotwell.plant.example',
  SMTP_URL: 'smtp://mail.plant.example:25',
};

function problemsOf(env: Record<string, string>): string[] {
  try {
    readConfig(env);
  } catch (error) {
    if (error instanceof ConfigError) return error.problems;
    throw error;
  }
  return [];
}

describe('readConfig', () => {
  it('takes the documented defaults', () => {
    const config = readConfig(minimal);
    expect(config).toMatchObject({ port: 5180, host: '127.0.0.1', shutdownGraceMs: 10_000, reminderIntervalMs: 60_000, anonymousTokenLimit: 300, logLevel: 'info' });
    expect(config.storage.kind).toBe('local');
    expect(config.redisUrl).toBeUndefined();
  });

  it('names a port that is not a whole number in range, rather than listening on NaN', () => {
    expect(problemsOf({ ...minimal, PORT: 'eighty' })).toEqual(['PORT must be a whole number from 0 to 65535 (it is "eighty")']);
    expect(problemsOf({ ...minimal, PORT: '70000' })[0]).toMatch(/^PORT /);
    expect(problemsOf({ ...minimal, SIGN_IN_ACCOUNT_FAILURES: '0' })[0]).toMatch(/^SIGN_IN_ACCOUNT_FAILURES must be a whole number from 1/);
    expect(problemsOf({ ...minimal, SHUTDOWN_GRACE_MS: '-5' })[0]).toMatch(/^SHUTDOWN_GRACE_MS /);
  });

  it('names every missing variable at once', () => {
    expect(problemsOf({})).toEqual([expect.stringMatching(/^DATABASE_URL is not set/), expect.stringMatching(/^SESSION_SECRET is not set/)]);
  });

  it('in production also needs the public address, the mail service and a long session secret', () => {
    expect(problemsOf(production)).toEqual([]);
    const { PUBLIC_URL: _p, SMTP_URL: _s, ...missing } = production;
    expect(problemsOf({ ...missing, SESSION_SECRET: 'short' })).toEqual([
      'SESSION_SECRET must be at least 32 characters in production (it has 5)',
      expect.stringMatching(/^PUBLIC_URL is not set/),
      expect.stringMatching(/^SMTP_URL is not set/),
    ]);
  });

  it('refuses addresses of the wrong kind', () => {
    expect(problemsOf({ ...minimal, REDIS_URL: 'localhost:6379' })).toEqual(['REDIS_URL must be an address like redis://127.0.0.1:6379']);
    expect(problemsOf({ ...minimal, DATABASE_URL: 'postgres://x@y/z' })[0]).toMatch(/^DATABASE_URL must be an address like mariadb:/);
    expect(problemsOf({ ...minimal, LOG_LEVEL: 'loud' })[0]).toMatch(/^LOG_LEVEL must be one of fatal, error, warn, info/);
  });

  it('needs every S3 setting with STORAGE=s3 — no placeholder credentials', () => {
    const problems = problemsOf({ ...minimal, STORAGE: 's3', STORAGE_S3_ENDPOINT: 'https://s3.plant.example' });
    expect(problems.map((p) => p.split(' ')[0])).toEqual(['STORAGE_S3_BUCKET', 'STORAGE_S3_KEY', 'STORAGE_S3_SECRET']);
    const s3 = readConfig({ ...minimal, STORAGE: 's3', STORAGE_S3_ENDPOINT: 'https://s3.plant.example', STORAGE_S3_BUCKET: 'b', STORAGE_S3_KEY: 'k', STORAGE_S3_SECRET: 's' });
    expect(s3.storage).toMatchObject({ kind: 's3', bucket: 'b', accessKeyId: 'k', secretAccessKey: 's', region: 'us-east-1' });
  });
});
