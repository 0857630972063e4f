import fc from 'fast-check';

import { connect } from 'node:net';

import { API_PREFIX, TOKEN_HEADER } from '../../app/server/http-server';

export { backendChildStart, type BackendChild } from '../backend-start';

/**
 * Writes `data` on a fresh connection to 127.0.0.1:`port` and collects what comes back until the
 * server closes, `waitMs` passes, or the client resets the connection itself after
 * `resetAfterMs`. With `end` the client half-closes after writing (Node's server then drops an
 * answer not yet written, so requests whose answer is checked leave it open and ask
 * `Connection: close`).
 */
export function rawRequest(
  port: number,
  data: string | Uint8Array,
  options: { end?: boolean; resetAfterMs?: number; waitMs?: number } = {},
): Promise<string> {
  return new Promise((done) => {
    let text = '';
    let settled = false;
    const finish = () => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      socket.destroy();
      done(text);
    };
    const socket = connect(port, '127.0.0.1', () => {
      if (options.end) socket.end(data);
      else socket.write(data);
      if (options.resetAfterMs !== undefined) {
        setTimeout(() => {
          socket.resetAndDestroy();
          finish();
        }, options.resetAfterMs);
      }
    });
    const timer = setTimeout(finish, options.waitMs ?? 3000);
    socket.on('data', (d: Buffer) => (text += d.toString('latin1')));
    socket.on('end', finish);
    socket.on('close', finish);
    socket.on('error', finish);
  });
}

/** The status of a raw HTTP answer; 0 when there was none. */
export const rawStatusOf = (reply: string): number => Number(/^HTTP\/1\.[01] (\d{3})/.exec(reply)?.[1] ?? 0);

/**
 * Any request a client could send: a request line, headers and body built from HTTP's parts
 * (our routes, the token, Host forms, lengths that lie) and from arbitrary text, or raw bytes.
 */
export function httpRequestArbitrary(port: () => number, token: () => string): fc.Arbitrary<Uint8Array> {
  const text = (max: number) => fc.string({ maxLength: max, unit: 'binary' });
  const method = fc.oneof(
    fc.constantFrom('GET', 'POST', 'HEAD', 'PUT', 'OPTIONS', 'DELETE', 'CONNECT', 'TRACE'),
    fc.string({ maxLength: 8 }),
  );
  const target = fc.oneof(
    fc.constantFrom(
      '/',
      '/%00',
      'http://[',
      '*',
      `${API_PREFIX}call/echo`,
      `${API_PREFIX}call/crashes`,
      `${API_PREFIX}call/fails`,
      `${API_PREFIX}call/vehicleList`,
      `${API_PREFIX}call/analyzeCorner`,
      `${API_PREFIX}call/setupShow`,
      `${API_PREFIX}call/storeBackup`,
      `${API_PREFIX}jobs/start/benchImport`,
      `${API_PREFIX}jobs/00000000-0000-0000-0000-000000000000`,
      '/../../etc/passwd',
      '/%2e%2e/%c0%af',
    ),
    text(40).map((s) => `/${s}`),
    fc.webUrl(),
    text(40),
  );
  const version = fc.constantFrom('HTTP/1.1', 'HTTP/1.0', 'HTTP/2.0', 'HTTP/9', '');
  const header = fc.oneof(
    fc.constant(() => `Host: 127.0.0.1:${port()}\r\n`),
    fc.constant(() => `${TOKEN_HEADER}: ${token()}\r\n`),
    fc
      .constantFrom(
        'Content-Length: 5\r\n',
        'Content-Length: 100000000\r\n',
        'Content-Length: abc\r\n',
        'Transfer-Encoding: chunked\r\n',
        'Expect: 100-continue\r\n',
        'Connection: keep-alive\r\n',
        'Host: 127.1\r\n',
        'Origin: http://evil.example\r\n',
      )
      .map((h) => () => h),
    fc.tuple(text(20), text(40)).map(
      ([n, v]) =>
        () =>
          `${n}: ${v}\r\n`,
    ),
  );
  const request = fc.record({
    method,
    target,
    version,
    headers: fc.array(header, { maxLength: 6 }),
    body: fc.oneof(text(200), fc.json({ maxDepth: 3 })),
  });
  const rawBytes = fc.uint8Array({ maxLength: 300 });
  return fc.oneof(
    request.map((r) =>
      Buffer.from(
        `${r.method} ${r.target} ${r.version}\r\n${r.headers.map((h) => h()).join('')}\r\n${r.body}`,
        'latin1',
      ),
    ),
    rawBytes,
  );
}
