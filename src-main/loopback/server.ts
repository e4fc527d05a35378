// The loopback host: the main-process handlers served over HTTP on 127.0.0.1, with the built
// renderer. It is what `npm start` serves to a local browser where the Electron runtime is
// missing, and what the end-to-end tests drive in Chromium. Every request must carry the run's
// random token (a SameSite cookie set from the one-time ?token= link, plus a header on IPC calls),
// and the Host header must name this loopback address, which defeats DNS rebinding.
import http from 'node:http';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import { dispatch } from '../handlers/dispatch';
import type { HandlerContext } from '../handlers/context';
import { SECURITY_HEADERS } from '../security/csp';
import { bridgeScript } from './bridge-script';
import { newToken, sameToken } from './token';

const MIME: Readonly<Record<string, string>> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.woff2': 'font/woff2',
};

const COOKIE = 'plumbline-token';
const MAX_BODY_BYTES = 64 * 1024 * 1024;

export interface LoopbackOptions {
  readonly rendererDir: string;
  readonly ctx: HandlerContext;
  /** 0 (the default) picks a free port. */
  readonly port?: number;
  readonly token?: string;
}

export interface LoopbackHost {
  /** The address to open, with the one-time token. */
  readonly url: string;
  readonly origin: string;
  readonly token: string;
  /** Channels called so far, in order (for tests and diagnostics). */
  readonly calls: string[];
  close(): Promise<void>;
}

function readCookie(header: string | undefined, name: string): string | undefined {
  if (header === undefined) return undefined;
  for (const part of header.split(';')) {
    const [key, ...rest] = part.trim().split('=');
    if (key === name) return rest.join('=');
  }
  return undefined;
}

async function readBody(request: http.IncomingMessage): Promise<string | null> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const chunk of request) {
    const buffer = chunk as Buffer;
    size += buffer.length;
    if (size > MAX_BODY_BYTES) return null;
    chunks.push(buffer);
  }
  return Buffer.concat(chunks).toString('utf8');
}

function send(response: http.ServerResponse, status: number, body: string | Buffer, type = 'text/plain; charset=utf-8'): void {
  response.writeHead(status, { ...SECURITY_HEADERS, 'content-type': type });
  response.end(body);
}

export async function startLoopbackHost(options: LoopbackOptions): Promise<LoopbackHost> {
  const root = path.resolve(options.rendererDir);
  const token = options.token ?? newToken();
  const calls: string[] = [];
  let allowedHosts: readonly string[] = [];
  let origin = '';

  const server = http.createServer((request, response) => {
    void handle(request, response).catch(() => {
      if (!response.headersSent) send(response, 500, 'internal error');
    });
  });

  async function handle(request: http.IncomingMessage, response: http.ServerResponse): Promise<void> {
    if (!allowedHosts.includes(request.headers.host ?? '')) return send(response, 421, 'wrong host');
    const url = new URL(request.url ?? '/', origin);
    const cookieOk = sameToken(readCookie(request.headers.cookie, COOKIE), token);

    if (request.method === 'GET' && (url.pathname === '/' || url.pathname === '/index.html') && url.searchParams.has('token')) {
      if (!sameToken(url.searchParams.get('token') ?? undefined, token)) return send(response, 403, 'wrong token');
      response.writeHead(303, {
        ...SECURITY_HEADERS,
        'set-cookie': `${COOKIE}=${token}; HttpOnly; SameSite=Strict; Path=/`,
        location: '/',
      });
      response.end();
      return;
    }
    if (!cookieOk) return send(response, 403, 'This address needs the link with its token, as printed when Plumbline started.');

    if (url.pathname.startsWith('/__ipc/')) {
      if (request.method !== 'POST') return send(response, 405, 'method not allowed');
      const headerToken = request.headers['x-plumbline-token'];
      if (!sameToken(typeof headerToken === 'string' ? headerToken : undefined, token)) return send(response, 403, 'wrong token');
      if (request.headers.origin !== undefined && request.headers.origin !== origin) return send(response, 403, 'wrong origin');
      if (!(request.headers['content-type'] ?? '').startsWith('application/json')) return send(response, 415, 'JSON only');
      const body = await readBody(request);
      if (body === null) return send(response, 413, 'request too large');
      let payload: unknown;
      try {
        payload = body === '' ? {} : JSON.parse(body);
      } catch {
        return send(response, 400, 'request is not JSON');
      }
      const channel = decodeURIComponent(url.pathname.slice('/__ipc/'.length));
      calls.push(channel);
      const envelope = await dispatch(channel, payload, options.ctx);
      return send(response, 200, JSON.stringify(envelope), MIME['.json']);
    }

    if (request.method !== 'GET') return send(response, 405, 'method not allowed');
    if (url.pathname === '/favicon.ico') {
      response.writeHead(204, SECURITY_HEADERS);
      response.end();
      return;
    }
    if (url.pathname === '/__bridge.js') return send(response, 200, bridgeScript(token), MIME['.js']);

    const relative = url.pathname === '/' ? 'index.html' : decodeURIComponent(url.pathname).replace(/^\/+/, '');
    const file = path.resolve(root, relative);
    if (!file.startsWith(root + path.sep)) return send(response, 403, 'outside the app');
    let data: Buffer;
    try {
      data = await readFile(file);
    } catch {
      return send(response, 404, 'not found');
    }
    if (path.basename(file) === 'index.html') {
      // The stand-in preload must run before the app's module script.
      const html = data.toString('utf8').replace('<script', '<script src="./__bridge.js"></script>\n    <script');
      return send(response, 200, html, MIME['.html']);
    }
    return send(response, 200, data, MIME[path.extname(file)] ?? 'application/octet-stream');
  }

  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, '127.0.0.1', () => resolve());
  });
  const { port } = server.address() as AddressInfo;
  origin = `http://127.0.0.1:${port}`;
  allowedHosts = [`127.0.0.1:${port}`, `localhost:${port}`];

  return {
    url: `${origin}/?token=${token}`,
    origin,
    token,
    calls,
    close: () =>
      new Promise<void>((resolve, reject) => {
        server.closeAllConnections();
        server.close((error) => (error ? reject(error) : resolve()));
      }),
  };
}
