import { createHash } from 'node:crypto';
import type { BenchPoints } from '../core/damper/bench-trace';

/**
 * Points as stored: float64 pairs (velocity, force) interleaved. Little-endian is the byte
 * order of every machine the program runs on (x86-64, arm64); `benchPointsDecode` reads it
 * explicitly, so a file moved to another machine reads the same.
 */
export function benchPointsEncode(p: BenchPoints): Buffer {
  const n = p.velocity.length;
  const buf = Buffer.allocUnsafe(16 * n);
  for (let i = 0; i < n; i++) {
    buf.writeDoubleLE(p.velocity[i] as number, 16 * i);
    buf.writeDoubleLE(p.force[i] as number, 16 * i + 8);
  }
  return buf;
}

export function benchPointsDecode(buf: Buffer): BenchPoints {
  const n = Math.floor(buf.length / 16);
  const velocity = new Float64Array(n);
  const force = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    velocity[i] = buf.readDoubleLE(16 * i);
    force[i] = buf.readDoubleLE(16 * i + 8);
  }
  return { velocity, force };
}

/** A raw trace as stored: float64 triples (time, displacement, force). */
export function benchTraceEncode(t: {
  time: Float64Array;
  displacement: Float64Array;
  force: Float64Array;
}): Buffer {
  const n = t.time.length;
  const buf = Buffer.allocUnsafe(24 * n);
  for (let i = 0; i < n; i++) {
    buf.writeDoubleLE(t.time[i] as number, 24 * i);
    buf.writeDoubleLE(t.displacement[i] as number, 24 * i + 8);
    buf.writeDoubleLE(t.force[i] as number, 24 * i + 16);
  }
  return buf;
}

export function sha256Hex(data: Buffer | string): string {
  return createHash('sha256').update(data).digest('hex');
}
