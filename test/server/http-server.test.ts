import { mkdtempSync, mkdirSync, writeFileSync } from 'node:fs';
import { request } from 'node:http';
import { connect } from 'node:net';
import { networkInterfaces, tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { API_PREFIX, TOKEN_HEADER, serverStart, type RunningServer } from '../../app/server/http-server';
import { InputError } from '../../core/units/input-error';

type Reply = { status: number; body: string; headers: Record<string, string | string[] | undefined> };

/** A raw HTTP request, so that tests can send any Host header they like. */
function send(
  port: number,
  options: { method?: string; path: string; headers?: Record<string, string>; body?: string; host?: string },
): Promise<Reply> {
  return new Promise((done, fail) => {
    const req = request(
      {
        host: options.host ?? '127.0.0.1',
        port,
        method: options.method ?? 'GET',
        path: options.path,
        headers: options.headers,
      },
      (res) => {
        let body = '';
        res.setEncoding('utf8');
        res.on('data', (c: string) => (body += c));
        res.on('end', () => done({ status: res.statusCode ?? 0, body, headers: res.headers }));
      },
    );
    req.on('error', fail);
    if (options.body) req.write(options.body);
    req.end();
  });
}

let server: RunningServer;
let staticDir: string;
const calls: { name: string; input: unknown }[] = [];

beforeAll(async () => {
  staticDir = mkdtempSync(join(tmpdir(), 'rideledger-static-'));
  writeFileSync(join(staticDir, 'index.html'), '<!doctype html><title>RideLedger</title>');
  mkdirSync(join(staticDir, 'assets'));
  writeFileSync(join(staticDir, 'assets', 'app.js'), 'console.log(1)');
  writeFileSync(join(tmpdir(), 'rideledger-secret.txt'), 'secret');
  server = await serverStart({
    staticDir,
    dispatch: async (name, input) => {
      calls.push({ name, input });
      if (name === 'echo') return { got: input };
      if (name === 'fails') throw new InputError('corner.springRate', 'got "70 kg" (a mass)');
      if (name === 'crashes') throw new Error('boom');
      throw Object.assign(new Error(`unknown handler ${name}`), { unknownHandler: true });
    },
    describeError: (e) =>
      e instanceof InputError
        ? { status: 400, field: e.field, message: e.message }
        : (e as { unknownHandler?: boolean }).unknownHandler
          ? { status: 404, message: (e as Error).message }
          : undefined,
    log: () => {},
  });
});
afterAll(() => server.close());

const auth = () => ({
  [TOKEN_HEADER]: server.token,
  'content-type': 'application/json',
  host: `127.0.0.1:${server.port}`,
});

describe('the loopback server', () => {
  it('listens on 127.0.0.1 only and prints a URL that carries the token', () => {
    expect(server.origin).toBe(`http://127.0.0.1:${server.port}`);
    expect(new URL(server.url).hash).toBe(`#token=${server.token}`);
    expect(server.token.length).toBeGreaterThanOrEqual(32);
  });

  it('is not reachable on any other interface', async () => {
    const others = Object.values(networkInterfaces())
      .flat()
      .filter((i) => i && i.family === 'IPv4' && !i.internal)
      .map((i) => i?.address as string);
    for (const address of others) {
      await expect(send(server.port, { host: address, path: '/' })).rejects.toThrow(
        /ECONNREFUSED|EHOSTUNREACH|ENETUNREACH/,
      );
    }
  });

  it('answers an API request without the token 401, before routing', async () => {
    const before = calls.length;
    for (const path of [`${API_PREFIX}call/echo`, `${API_PREFIX}no/such/route`, `${API_PREFIX}`]) {
      const r = await send(server.port, {
        method: 'POST',
        path,
        headers: { host: `127.0.0.1:${server.port}` },
        body: '{}',
      });
      expect(r.status).toBe(401);
    }
    const wrong = await send(server.port, {
      method: 'POST',
      path: `${API_PREFIX}call/echo`,
      headers: { ...auth(), [TOKEN_HEADER]: 'x'.repeat(43) },
      body: '{}',
    });
    expect(wrong.status).toBe(401);
    expect(calls.length).toBe(before);
  });

  it('refuses a request with a wrong Host header, with or without the token', async () => {
    for (const host of [
      'evil.example',
      `evil.example:${server.port}`,
      `127.0.0.1:${server.port + 1}`,
      `[::1]:${server.port}`,
    ]) {
      const r = await send(server.port, {
        method: 'POST',
        path: `${API_PREFIX}call/echo`,
        headers: { ...auth(), host },
        body: '{}',
      });
      expect(r.status).toBe(403);
      const page = await send(server.port, { path: '/', headers: { host } });
      expect(page.status).toBe(403);
    }
  });

  it('refuses a request with no Host header at all', async () => {
    const reply = await new Promise<string>((done, fail) => {
      const socket = connect(server.port, '127.0.0.1', () =>
        socket.end(`GET / HTTP/1.0\r\n${TOKEN_HEADER}: ${server.token}\r\n\r\n`),
      );
      let text = '';
      socket.on('data', (d) => (text += d.toString()));
      socket.on('end', () => done(text));
      socket.on('error', fail);
    });
    expect(reply).toMatch(/^HTTP\/1\.[01] 403/);
  });

  it('refuses an API call from another origin even with the token', async () => {
    const r = await send(server.port, {
      method: 'POST',
      path: `${API_PREFIX}call/echo`,
      headers: { ...auth(), origin: 'http://evil.example' },
      body: '{}',
    });
    expect(r.status).toBe(403);
  });

  it('runs a call with the token and returns its value', async () => {
    const r = await send(server.port, {
      method: 'POST',
      path: `${API_PREFIX}call/echo`,
      headers: { ...auth(), origin: server.origin },
      body: '{"a":1}',
    });
    expect(r.status).toBe(200);
    expect(JSON.parse(r.body)).toEqual({ value: { got: { a: 1 } } });
  });

  it('reports bad input 400 with the field, unknown handlers 404, crashes 500 without details', async () => {
    const bad = await send(server.port, {
      method: 'POST',
      path: `${API_PREFIX}call/fails`,
      headers: auth(),
      body: '{}',
    });
    expect(bad.status).toBe(400);
    expect(JSON.parse(bad.body).error.field).toBe('corner.springRate');
    const unknown = await send(server.port, {
      method: 'POST',
      path: `${API_PREFIX}call/nothing`,
      headers: auth(),
      body: '{}',
    });
    expect(unknown.status).toBe(404);
    const crash = await send(server.port, {
      method: 'POST',
      path: `${API_PREFIX}call/crashes`,
      headers: auth(),
      body: '{}',
    });
    expect(crash.status).toBe(500);
    expect(crash.body).not.toContain('boom');
    const notJson = await send(server.port, {
      method: 'POST',
      path: `${API_PREFIX}call/echo`,
      headers: auth(),
      body: '{nope',
    });
    expect(notJson.status).toBe(400);
    const get = await send(server.port, { path: `${API_PREFIX}call/echo`, headers: auth() });
    expect(get.status).toBe(405);
  });

  it('serves the renderer with a strict CSP, and nothing outside its folder', async () => {
    const page = await send(server.port, { path: '/', headers: { host: `127.0.0.1:${server.port}` } });
    expect(page.status).toBe(200);
    expect(page.body).toContain('RideLedger');
    expect(page.headers['content-security-policy']).toContain("default-src 'self'");
    expect(page.headers['x-content-type-options']).toBe('nosniff');
    const js = await send(server.port, {
      path: '/assets/app.js',
      headers: { host: `localhost:${server.port}` },
    });
    expect(js.status).toBe(200);
    expect(js.headers['content-type']).toContain('javascript');
    for (const path of [
      '/../rideledger-secret.txt',
      '/assets/../../rideledger-secret.txt',
      '/%2e%2e/rideledger-secret.txt',
    ]) {
      const r = await send(server.port, { path, headers: { host: `127.0.0.1:${server.port}` } });
      expect(r.body).not.toContain('secret');
    }
    const spa = await send(server.port, { path: '/vehicles', headers: { host: `127.0.0.1:${server.port}` } });
    expect(spa.body).toContain('RideLedger');
    const missing = await send(server.port, {
      path: '/assets/none.js',
      headers: { host: `127.0.0.1:${server.port}` },
    });
    expect(missing.status).toBe(404);
  });
});
