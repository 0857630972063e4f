import { randomBytes, timingSafeEqual } from 'node:crypto';
import { createReadStream, statSync } from 'node:fs';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { extname, join, resolve, sep } from 'node:path';
import { electronConfig } from '../../electron.config';

/** Where an API call goes: the handler name and its JSON input; returns the JSON output. */
export type ApiDispatch = (name: string, input: unknown) => Promise<unknown>;

/** How the dispatcher reports a failure the client should see (bad input, unknown handler). */
export type ApiFailure = { status: 400 | 404 | 409 | 413 | 503; field?: string; message: string };

export type ServerOptions = {
  dispatch: ApiDispatch;
  /**
   * Takes a call as its body's text, unread, where it is run elsewhere (a thread that reads the
   * JSON itself): this thread then never parses nor copies a large input. Undefined leaves the
   * call to `dispatch`.
   */
  dispatchText?: (name: string, body: string) => Promise<unknown> | undefined;
  /** Turns an error thrown by `dispatch` into what the client sees; undefined means "internal error". */
  describeError: (error: unknown) => ApiFailure | undefined;
  /** Folder of the built renderer; without it only the API is served. */
  staticDir?: string;
  /** 0 (the default) takes any free port. */
  port?: number;
  /** The per-start secret; a random one unless given (tests). */
  token?: string;
  /** Largest request body accepted (bytes); bench files can be large. */
  maxBodyBytes?: number;
  log?: (line: string) => void;
  /** Long calls run as jobs: started, polled for their state, cancelled. */
  jobs?: {
    start: (name: string, input: unknown) => string;
    get: (id: string) => unknown;
    cancel: (id: string) => Promise<unknown>;
  };
};

export type RunningServer = {
  /** http://127.0.0.1:PORT */
  origin: string;
  port: number;
  token: string;
  /** The address to open: the origin with the token in the fragment, which the browser never sends. */
  url: string;
  close: () => Promise<void>;
};

/** Header that carries the token on every API request. */
export const TOKEN_HEADER = 'x-rideledger-token';

/** What a request whose body is not JSON is told. */
export const BAD_JSON = 'the request body is not valid JSON';

/** Prefix of every API route; every request under it needs the token. */
export const API_PREFIX = '/api/';

const CONTENT_TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.woff2': 'font/woff2',
  '.csv': 'text/csv; charset=utf-8',
};

function securityHeaders(res: ServerResponse): void {
  res.setHeader('Content-Security-Policy', electronConfig.contentSecurityPolicy);
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader('Referrer-Policy', 'no-referrer');
  res.setHeader('X-Frame-Options', 'DENY');
  res.setHeader('Cross-Origin-Opener-Policy', 'same-origin');
  res.setHeader('Cross-Origin-Resource-Policy', 'same-origin');
}

function sendJson(res: ServerResponse, status: number, body: unknown): void {
  const text = JSON.stringify(body);
  // An answer already begun, or a client already gone, gets nothing more.
  if (res.headersSent || res.writableEnded || res.destroyed) return;
  res.writeHead(status, { 'Content-Type': 'application/json; charset=utf-8', 'Cache-Control': 'no-store' });
  res.end(text);
}

function tokenMatches(given: string | undefined, token: string): boolean {
  if (typeof given !== 'string') return false;
  const a = Buffer.from(given);
  const b = Buffer.from(token);
  return a.length === b.length && timingSafeEqual(a, b);
}

/**
 * Only our own host names, on our own port, are answered: a page elsewhere that points a
 * name of its own at 127.0.0.1 (DNS rebinding) sends its own Host and is refused. The header
 * must be exactly `127.0.0.1:PORT` or `localhost:PORT` (without the port only when it is 80,
 * which a browser leaves out): no other spelling of the loopback address (`127.1`,
 * `0x7f.0.0.1`, `LOCALHOST.`, `127.0.0.1.`), no user part, no path. `[::1]` is refused too,
 * since the server listens on 127.0.0.1 only.
 */
export function hostAllowed(hostHeader: string | undefined, port: number): boolean {
  if (typeof hostHeader !== 'string') return false;
  const colon = hostHeader.lastIndexOf(':');
  const name = colon === -1 ? hostHeader : hostHeader.slice(0, colon);
  const portText = colon === -1 ? null : hostHeader.slice(colon + 1);
  if (name !== '127.0.0.1' && name !== 'localhost') return false;
  if (portText === null) return port === 80;
  return /^[1-9][0-9]{0,4}$/.test(portText) && Number(portText) === port;
}

/** A body over the limit: answered 413, the rest of it never read. */
class BodyTooLarge extends Error {}

/** The client closed its connection before its request was whole: nobody is left to answer. */
class ClientGone extends Error {}

/**
 * Reads a request body up to `limit` bytes, counting while it streams: a larger one is refused
 * before it is held. Rejects when the client goes away mid-body (the caller's boundary answers).
 */
function readBody(req: IncomingMessage, limit: number): Promise<string> {
  return new Promise((done, fail) => {
    const chunks: Buffer[] = [];
    let size = 0;
    const onData = (chunk: Buffer) => {
      size += chunk.length;
      if (size > limit) {
        cleanup();
        fail(new BodyTooLarge());
        return;
      }
      chunks.push(chunk);
    };
    const onEnd = () => {
      cleanup();
      done(Buffer.concat(chunks).toString('utf8'));
    };
    const onError = (e: Error) => {
      cleanup();
      fail(e);
    };
    const onClose = () => {
      if (!req.complete) onError(new ClientGone('the client closed the connection before the body ended'));
    };
    const cleanup = () => {
      req.off('data', onData);
      req.off('end', onEnd);
      req.off('error', onError);
      req.off('close', onClose);
    };
    req.on('data', onData);
    req.on('end', onEnd);
    req.on('error', onError);
    req.on('close', onClose);
  });
}

function hasControlCharacter(text: string): boolean {
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x20 || c === 0x7f) return true;
  }
  return false;
}

function serveStatic(root: string, pathname: string, res: ServerResponse): void {
  let decoded: string;
  try {
    decoded = decodeURIComponent(pathname);
  } catch {
    sendJson(res, 400, { error: { message: 'bad path' } });
    return;
  }
  // A NUL (or any control character) names no file of ours; the file system would refuse it.
  if (hasControlCharacter(decoded)) {
    sendJson(res, 400, { error: { message: 'bad path' } });
    return;
  }
  const base = resolve(root);
  let file = resolve(join(base, decoded));
  // Never outside the renderer's folder, whatever the path says.
  if (file !== base && !file.startsWith(base + sep)) {
    sendJson(res, 404, { error: { message: 'not found' } });
    return;
  }
  let stat = statSync(file, { throwIfNoEntry: false });
  if (!stat || stat.isDirectory()) {
    // The single-page app answers every route that is not a file with its index.
    if (extname(decoded) !== '' && decoded !== '/') {
      sendJson(res, 404, { error: { message: 'not found' } });
      return;
    }
    file = join(base, 'index.html');
    stat = statSync(file, { throwIfNoEntry: false });
    if (!stat) {
      sendJson(res, 404, { error: { message: 'the renderer is not built (npm run build:renderer)' } });
      return;
    }
  }
  const type = CONTENT_TYPES[extname(file)] ?? 'application/octet-stream';
  const stream = createReadStream(file);
  // A file that goes away between the look-up and the read ends this answer, not the server.
  stream.once('error', () => {
    if (!res.headersSent) sendJson(res, 404, { error: { message: 'not found' } });
    else res.destroy();
  });
  stream.once('open', () => {
    res.writeHead(200, {
      'Content-Type': type,
      'Content-Length': (stat as { size: number }).size,
      'Cache-Control': file.endsWith('index.html') ? 'no-store' : 'public, max-age=31536000, immutable',
    });
    stream.pipe(res);
  });
  res.once('close', () => stream.destroy());
}

/** Largest request body accepted by default (bytes): a bench trace of a million readings fits. */
export const MAX_BODY_BYTES = 64 * 1024 * 1024;

/** Answers a request the boundary caught, if it can still be answered; else drops the connection. */
function sendIfOpen(res: ServerResponse, status: number, message: string, close = false): void {
  if (res.headersSent || res.destroyed || res.writableEnded) {
    if (!res.writableEnded) res.destroy();
    return;
  }
  if (close) res.setHeader('Connection', 'close');
  sendJson(res, status, { error: { message } });
}

/** What the server says on a socket the HTTP parser refused (before any request exists). */
function clientErrorAnswer(code: string | undefined): string {
  if (code === 'HPE_HEADER_OVERFLOW') return '431 Request Header Fields Too Large';
  if (code === 'ERR_HTTP_REQUEST_TIMEOUT') return '408 Request Timeout';
  return '400 Bad Request';
}

/**
 * The backend's HTTP face: the API contract on 127.0.0.1 behind a per-start token, and the
 * built renderer. Every request's Host must be ours; every request under /api/ without the
 * token is answered 401 before any routing; cross-origin API requests are refused.
 *
 * No request can end the process: each one runs inside one boundary that answers 400, 413 or
 * 500 and logs what it did not expect; a request the parser refuses is answered 400 on its
 * socket; a client that goes away mid-request only loses its own answer.
 */
export async function serverStart(options: ServerOptions): Promise<RunningServer> {
  const token = options.token ?? randomBytes(32).toString('base64url');
  const maxBody = options.maxBodyBytes ?? MAX_BODY_BYTES;
  const log = options.log ?? ((line: string) => console.error(line));
  let port = 0;

  function unexpected(e: unknown, what: string): void {
    try {
      log(`internal error in ${what}: ${(e as Error | undefined)?.stack ?? String(e)}`);
    } catch {
      // A log that throws must not end the server either.
    }
  }

  const server: Server = createServer((req, res) => {
    // A reset while the body streams, or a write to a closed socket: that request's loss only.
    req.on('error', (e) => {
      if ((e as NodeJS.ErrnoException).code !== 'ECONNRESET') unexpected(e, 'reading a request');
    });
    res.on('error', (e) => {
      if ((e as NodeJS.ErrnoException).code !== 'ECONNRESET') unexpected(e, 'writing an answer');
    });
    requestHandle(req, res).catch((e: unknown) => {
      if (e instanceof BodyTooLarge) {
        sendIfOpen(res, 413, `request larger than ${maxBody} bytes`, true);
        // The rest of the body is not read: the connection ends once the answer is out.
        res.once('finish', () => setTimeout(() => req.socket.destroy(), 200).unref());
        req.resume();
        return;
      }
      if (e instanceof ClientGone || req.destroyed || res.destroyed) {
        // The client went away (mid-upload or mid-answer): nobody is left to answer.
        if (!res.writableEnded) res.destroy();
        return;
      }
      unexpected(e, `${req.method ?? '?'} request`);
      sendIfOpen(res, 500, 'internal error; see the server log');
    });
  });

  server.on('clientError', (e: NodeJS.ErrnoException, socket) => {
    if (e.code === 'ECONNRESET' || !socket.writable) {
      socket.destroy();
      return;
    }
    socket.end(`HTTP/1.1 ${clientErrorAnswer(e.code)}\r\nConnection: close\r\nContent-Length: 0\r\n\r\n`);
  });

  async function requestHandle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    securityHeaders(res);
    if (!hostAllowed(req.headers.host, port)) {
      sendJson(res, 403, { error: { message: 'wrong host' } });
      return;
    }
    let url: URL;
    try {
      url = new URL(req.url ?? '/', `http://127.0.0.1:${port}`);
    } catch {
      sendJson(res, 400, { error: { message: 'the request target is not a valid path' } });
      return;
    }
    if (url.pathname.startsWith(API_PREFIX)) {
      if (!tokenMatches(req.headers[TOKEN_HEADER] as string | undefined, token)) {
        sendJson(res, 401, { error: { message: 'missing or wrong token' } });
        return;
      }
      const origin = req.headers.origin;
      if (
        origin !== undefined &&
        origin !== `http://127.0.0.1:${port}` &&
        origin !== `http://localhost:${port}`
      ) {
        sendJson(res, 403, { error: { message: 'cross-origin request refused' } });
        return;
      }
      await handleApi(url.pathname.slice(API_PREFIX.length), req, res);
      return;
    }
    if (req.method !== 'GET' && req.method !== 'HEAD') {
      sendJson(res, 405, { error: { message: 'method not allowed' } });
      return;
    }
    if (!options.staticDir) {
      sendJson(res, 404, { error: { message: 'not found' } });
      return;
    }
    serveStatic(options.staticDir, url.pathname, res);
  }

  function sendFailure(res: ServerResponse, e: unknown, what: string): void {
    const failure = options.describeError(e);
    if (failure) {
      sendJson(res, failure.status, { error: { field: failure.field, message: failure.message } });
    } else {
      unexpected(e, what);
      sendIfOpen(res, 500, 'internal error; see the server log');
    }
  }
  async function handleApi(route: string, req: IncomingMessage, res: ServerResponse): Promise<void> {
    const call = /^call\/([A-Za-z][A-Za-z0-9]*)$/.exec(route);
    const jobStart = /^jobs\/start\/([A-Za-z][A-Za-z0-9]*)$/.exec(route);
    const job = /^jobs\/([0-9a-f-]{36})(\/cancel)?$/.exec(route);
    if (!call && !jobStart && !(job && options.jobs)) {
      sendJson(res, 404, { error: { message: `no API route "${route}"` } });
      return;
    }
    if (job && options.jobs) {
      const id = job[1] as string;
      if (job[2] ? req.method !== 'POST' : req.method !== 'GET') {
        sendJson(res, 405, { error: { message: job[2] ? 'cancel is POST' : 'job state is GET' } });
        return;
      }
      const state = job[2] ? await options.jobs.cancel(id) : options.jobs.get(id);
      if (state === undefined) sendJson(res, 404, { error: { message: 'no such job' } });
      else sendJson(res, 200, { value: state });
      return;
    }
    if (req.method !== 'POST') {
      sendJson(res, 405, { error: { message: 'API calls are POST' } });
      return;
    }
    const name = ((call ?? jobStart) as RegExpExecArray)[1] as string;
    const text = await readBody(req, maxBody);
    try {
      const elsewhere = call ? options.dispatchText?.(name, text) : undefined;
      if (elsewhere) {
        sendJson(res, 200, { value: await elsewhere });
        return;
      }
      let input: unknown;
      try {
        input = text === '' ? {} : JSON.parse(text);
      } catch {
        sendJson(res, 400, { error: { message: BAD_JSON } });
        return;
      }
      if (jobStart) {
        if (!options.jobs) throw new Error('jobs are not available');
        sendJson(res, 200, { value: { job: options.jobs.start(name, input) } });
      } else {
        sendJson(res, 200, { value: await options.dispatch(name, input) });
      }
    } catch (e) {
      sendFailure(res, e, name);
    }
  }

  await new Promise<void>((done, fail) => {
    server.once('error', fail);
    server.listen(options.port ?? 0, '127.0.0.1', () => done());
  });
  // Whatever the listening socket reports later (too many open files…) is logged, never fatal.
  server.on('error', (e) => unexpected(e, 'the server'));
  port = (server.address() as AddressInfo).port;
  const origin = `http://127.0.0.1:${port}`;
  return {
    origin,
    port,
    token,
    url: `${origin}/#token=${token}`,
    close: () =>
      new Promise<void>((done) => {
        server.closeAllConnections();
        server.close(() => done());
      }),
  };
}
