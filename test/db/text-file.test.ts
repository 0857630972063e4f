import { truncateSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { TEXT_FILE_MAX_BYTES, textFileRead } from '../../db/text-file';
import { tempFolder } from './store-fixture';

describe('textFileRead', () => {
  it('reads UTF-8, and UTF-16 in either byte order when the file starts with its mark', () => {
    const dir = tempFolder();
    const text = 'velocity,force (Dämpfer Ω)\n0.1,300\n';
    writeFileSync(join(dir, 'a.csv'), text, 'utf8');
    writeFileSync(
      join(dir, 'le.csv'),
      Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]),
    );
    const be = Buffer.from(text, 'utf16le');
    be.swap16();
    writeFileSync(join(dir, 'be.csv'), Buffer.concat([Buffer.from([0xfe, 0xff]), be]));
    for (const f of ['a.csv', 'le.csv', 'be.csv']) expect(textFileRead(join(dir, f))).toBe(text);
  });

  it('names a missing file, a folder, and a file too large to read whole', () => {
    const dir = tempFolder();
    expect(() => textFileRead(join(dir, 'none.csv'))).toThrow(
      /none\.csv: cannot read the file: no such file/,
    );
    expect(() => textFileRead(dir)).toThrow(/is a folder|cannot read/);
    const huge = join(dir, 'huge.csv');
    writeFileSync(huge, '');
    truncateSync(huge, TEXT_FILE_MAX_BYTES + 1); // sparse: no disk space used
    expect(() => textFileRead(huge)).toThrow(
      /huge\.csv: is 256 MiB; files up to 256 MiB .* are read — split it/,
    );
  });
});
