// One HTTP request as a signed-in person makes it (session cookie, CSRF token on writes), for the
// load benchmarks: node's own client, so what is timed is the server and not a fetch layer.
import http from 'node:http';

export type Session = { cookie: string; csrf: string };
export type Answer = { status: number; text: string; setCookie?: string[] };

export function httpCall(agent: http.Agent, base: string, method: string, path: string, session: Session | null, body?: unknown): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const headers: Record<string, string> = { accept: 'application/json' };
    if (session?.cookie) headers.cookie = session.cookie;
    if (method !== 'GET' && session) headers['x-csrf-token'] = session.csrf;
    if (body !== undefined) headers['content-type'] = 'application/json';
    const request = http.request(new URL(path, base), { method, agent, headers }, (response) => {
      let text = '';
      response.setEncoding('utf8');
      response.on('data', (chunk: string) => (text += chunk));
      response.on('end', () => resolve({ status: response.statusCode ?? 0, text, setCookie: response.headers['set-cookie'] }));
    });
    request.on('error', reject);
    request.end(body === undefined ? undefined : JSON.stringify(body));
  });
}
