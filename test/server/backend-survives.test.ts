import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { API_PREFIX, TOKEN_HEADER } from '../../app/server/http-server';
import {
  backendChildStart,
  httpRequestArbitrary,
  rawRequest,
  rawStatusOf,
  type BackendChild,
} from './backend-child';

// The real backend process (app/server/main.ts) against the requests that used to end it
// (issue 11): after each it must still run and answer an API call. Loopback only.

let backend: BackendChild;

beforeAll(async () => {
  backend = await backendChildStart();
}, 90_000);
afterAll(() => backend.stop());

/** An API call on its own connection: the backend is alive and serving. */
async function stillServing(): Promise<void> {
  expect(backend.alive()).toBe(true);
  const reply = await rawRequest(
    backend.port,
    `POST ${API_PREFIX}call/vehicleList HTTP/1.1\r\nHost: 127.0.0.1:${backend.port}\r\n` +
      `${TOKEN_HEADER}: ${backend.token}\r\nContent-Type: application/json\r\nContent-Length: 2\r\n` +
      'Connection: close\r\n\r\n{}',
  );
  expect(rawStatusOf(reply)).toBe(200);
  expect(reply).toContain('"vehicles"');
}

const host = () => `Host: 127.0.0.1:${backend.port}\r\n`;

/** Every error was answered by the server's own boundary, none reached the process. */
const noEscapedError = () => expect(backend.log()).not.toContain('still serving');

describe('the backend process survives', () => {
  it('GET /%00, without a token', async () => {
    const reply = await rawRequest(backend.port, `GET /%00 HTTP/1.1\r\n${host()}Connection: close\r\n\r\n`);
    expect(rawStatusOf(reply)).toBe(400);
    await stillServing();
    noEscapedError();
  });

  it('a malformed request target (http://[)', async () => {
    const reply = await rawRequest(
      backend.port,
      `GET http://[ HTTP/1.1\r\n${host()}Connection: close\r\n\r\n`,
    );
    expect(rawStatusOf(reply)).toBe(400);
    await stillServing();
    noEscapedError();
  });

  it('a client that resets the connection in the middle of an upload', async () => {
    const head =
      `POST ${API_PREFIX}call/vehicleAdd HTTP/1.1\r\n${host()}${TOKEN_HEADER}: ${backend.token}\r\n` +
      'Content-Type: application/json\r\nContent-Length: 1000000\r\n\r\n{"name": "';
    for (let i = 0; i < 3; i++) {
      await rawRequest(backend.port, head + 'x'.repeat(64 * 1024), { resetAfterMs: 100 });
    }
    await stillServing();
    noEscapedError();
  });

  it('any request line, headers and body (property, 150 runs)', async () => {
    await fc.assert(
      fc.asyncProperty(
        httpRequestArbitrary(
          () => backend.port,
          () => backend.token,
        ),
        async (data) => {
          await rawRequest(backend.port, data, { end: true, waitMs: 1500 });
          await stillServing();
        },
      ),
      { numRuns: 150, seed: 20261103 },
    );
    noEscapedError();
  }, 180_000);
});
