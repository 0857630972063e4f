import fc from 'fast-check';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  API_PREFIX,
  TOKEN_HEADER,
  hostAllowed,
  serverStart,
  type RunningServer,
} from '../../app/server/http-server';
import { InputError } from '../../core/units/input-error';
import { httpRequestArbitrary, rawRequest, rawStatusOf } from './backend-child';

// Requests that ended the backend process (issue 11): each is sent on a raw socket to
// 127.0.0.1, and the server must answer a plain request afterwards.

let server: RunningServer;
const logged: string[] = [];

beforeAll(async () => {
  const staticDir = mkdtempSync(join(tmpdir(), 'rideledger-static-'));
  writeFileSync(join(staticDir, 'index.html'), '<!doctype html><title>RideLedger</title>');
  server = await serverStart({
    staticDir,
    maxBodyBytes: 64 * 1024,
    dispatch: async (name, input) => {
      if (name === 'echo') return { got: input };
      if (name === 'fails') throw new InputError('notes', 'is too long');
      if (name === 'crashes') throw new Error('boom');
      if (name === 'unsendable') return { big: 10n };
      throw Object.assign(new Error(`unknown handler ${name}`), { unknownHandler: true });
    },
    describeError: (e) =>
      e instanceof InputError
        ? { status: 400, field: e.field, message: e.message }
        : (e as { unknownHandler?: boolean }).unknownHandler
          ? { status: 404, message: (e as Error).message }
          : undefined,
    log: (line) => logged.push(line),
  });
});
afterAll(() => server.close());

const raw = (data: string | Uint8Array, options: Parameters<typeof rawRequest>[2] = {}) =>
  rawRequest(server.port, data, options);

const host = () => `Host: 127.0.0.1:${server.port}\r\n`;

/** A plain page request on its own connection: the server is still there. */
async function stillServing(): Promise<void> {
  const reply = await raw(`GET / HTTP/1.1\r\n${host()}Connection: close\r\n\r\n`);
  expect(reply).toMatch(/^HTTP\/1\.1 200/);
  expect(reply).toContain('RideLedger');
}

const statusOf = rawStatusOf;

describe('no request ends the server', () => {
  it('answers GET /%00 (a NUL in the path, no token needed) 400, and serves on', async () => {
    for (const path of ['/%00', '/%00.js', '/assets/%00/x', '/a%0a%00b']) {
      const reply = await raw(`GET ${path} HTTP/1.1\r\n${host()}Connection: close\r\n\r\n`);
      expect(statusOf(reply)).toBe(400);
    }
    await stillServing();
  });

  it('answers a malformed request target (http://[) 400, and serves on', async () => {
    for (const target of ['http://[', 'http://[::1', '//[', 'http://a:99999/']) {
      const reply = await raw(`GET ${target} HTTP/1.1\r\n${host()}Connection: close\r\n\r\n`);
      expect(statusOf(reply)).toBe(400);
    }
    await stillServing();
  });

  it('survives a client that resets the connection in the middle of an upload', async () => {
    const head =
      `POST ${API_PREFIX}call/echo HTTP/1.1\r\n${host()}${TOKEN_HEADER}: ${server.token}\r\n` +
      'Content-Type: application/json\r\nContent-Length: 50000\r\n\r\n{"notes": "';
    for (let i = 0; i < 3; i++) {
      const reply = await raw(head + 'x'.repeat(20000), { resetAfterMs: 50 });
      expect(reply).toBe('');
    }
    // The same, half-closed instead of reset: the body never comes whole.
    const cut = await raw(head + 'x'.repeat(100), { end: true, waitMs: 1000 });
    expect(statusOf(cut)).not.toBe(200);
    await stillServing();
  });

  it('answers an oversized body 413 while it streams, and serves on', async () => {
    const body = `{"notes":"${'x'.repeat(70 * 1024)}"}`;
    const reply = await raw(
      `POST ${API_PREFIX}call/echo HTTP/1.1\r\n${host()}${TOKEN_HEADER}: ${server.token}\r\n` +
        `Content-Length: ${body.length}\r\n\r\n${body}`,
    );
    expect(statusOf(reply)).toBe(413);
    await stillServing();
  });

  it('answers a request the parser refuses 400 on its socket, and serves on', async () => {
    for (const bad of [
      'GARBAGE\r\n\r\n',
      `GET / HTTP/1.1\r\nHost 127.0.0.1\r\n\r\n`,
      `GET / HTTP/1.1\r\n${host()}Content-Length: -1\r\n\r\n`,
      `POST / HTTP/1.1\r\n${host()}Content-Length: 1\r\nTransfer-Encoding: chunked\r\n\r\n`,
      '\u0000\u0001\u0002',
    ]) {
      const reply = await raw(bad);
      expect(statusOf(reply)).toBe(400);
    }
    await stillServing();
  });

  it('answers a handler whose value cannot be sent 500, logged, and serves on', async () => {
    const before = logged.length;
    const reply = await raw(
      `POST ${API_PREFIX}call/unsendable HTTP/1.1\r\n${host()}${TOKEN_HEADER}: ${server.token}\r\n` +
        'Content-Length: 2\r\nConnection: close\r\n\r\n{}',
    );
    expect(statusOf(reply)).toBe(500);
    expect(logged.length).toBeGreaterThan(before);
    await stillServing();
  });

  it('still answers after any request line, headers and body (property, 150 runs)', async () => {
    const requests = httpRequestArbitrary(
      () => server.port,
      () => server.token,
    );
    await fc.assert(
      fc.asyncProperty(requests, async (data) => {
        await raw(data, { end: true, waitMs: 1500 });
        await stillServing();
      }),
      { numRuns: 150, seed: 20261102 },
    );
  }, 120_000);
});

describe('the Host check', () => {
  it('accepts only 127.0.0.1:PORT and localhost:PORT', () => {
    const port = 41234;
    expect(hostAllowed(`127.0.0.1:${port}`, port)).toBe(true);
    expect(hostAllowed(`localhost:${port}`, port)).toBe(true);
    for (const spelled of [
      `127.1:${port}`,
      `0x7f.0.0.1:${port}`,
      `0177.0.0.1:${port}`,
      `2130706433:${port}`,
      `127.0.0.01:${port}`,
      `LOCALHOST.:${port}`,
      `localhost.:${port}`,
      `LOCALHOST:${port}`,
      `127.0.0.1.:${port}`,
      `[::1]:${port}`,
      `[::ffff:127.0.0.1]:${port}`,
      `127.0.0.2:${port}`,
      `evil.example:${port}`,
      `localhost.evil.example:${port}`,
      `127.0.0.1.evil.example:${port}`,
      `user@127.0.0.1:${port}`,
      `127.0.0.1:${port}/x`,
      `127.0.0.1:0${port}`,
      `127.0.0.1:${port}:${port}`,
      `127.0.0.1:+${port}`,
      ` 127.0.0.1:${port}`,
      `127.0.0.1:${port + 1}`,
      '127.0.0.1',
      'localhost',
      `127.0.0.1:`,
      '',
    ]) {
      expect(hostAllowed(spelled, port), spelled).toBe(false);
    }
    expect(hostAllowed(undefined, port)).toBe(false);
  });

  it('leaves the port out only where a browser does (port 80)', () => {
    expect(hostAllowed('127.0.0.1', 80)).toBe(true);
    expect(hostAllowed('localhost', 80)).toBe(true);
    expect(hostAllowed('127.0.0.1:80', 80)).toBe(true);
    expect(hostAllowed('127.1', 80)).toBe(false);
  });

  it('refuses the other spellings of loopback over the wire, 403', async () => {
    for (const name of ['127.1', '0x7f.0.0.1', 'LOCALHOST.', '127.0.0.1.', '[::1]']) {
      const reply = await raw(`GET / HTTP/1.1\r\nHost: ${name}:${server.port}\r\nConnection: close\r\n\r\n`);
      expect(statusOf(reply), name).toBe(403);
    }
    await stillServing();
  });
});
