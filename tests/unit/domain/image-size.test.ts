import { describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { encode } from 'fast-png';
import { readImageSize } from '../../../shared/domain/image-size';
import { firmContactLines } from '../../../shared/domain/firm-contact';

describe('readImageSize', () => {
  it('reads a PNG’s width and height from its IHDR chunk (PNG spec §11.2.2; file made by fast-png)', () => {
    const png = Buffer.from(encode({ width: 317, height: 45, data: new Uint8Array(317 * 45 * 4), channels: 4, depth: 8 }));
    expect(readImageSize(png)).toEqual({ kind: 'png', width: 317, height: 45 });
  });

  it('reads a JPEG’s size from its start-of-frame, past the APP segments ImageMagick writes (ITU-T T.81 §B.2.2)', () => {
    const baseline = execFileSync('convert', ['-size', '640x211', 'xc:#3F6B3A', 'jpg:-']);
    expect(readImageSize(baseline)).toEqual({ kind: 'jpeg', width: 640, height: 211 });
    const progressive = execFileSync('convert', ['-size', '99x1201', 'xc:white', '-interlace', 'Plane', '-set', 'comment', 'a comment segment', 'jpg:-']);
    expect(readImageSize(progressive)).toEqual({ kind: 'jpeg', width: 99, height: 1201 });
  });

  it('answers null for other formats and for headers cut short', () => {
    expect(readImageSize(execFileSync('convert', ['-size', '10x10', 'xc:white', 'gif:-']))).toBeNull();
    expect(readImageSize(Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"/>'))).toBeNull();
    const png = Buffer.from(encode({ width: 4, height: 4, data: new Uint8Array(48), channels: 3, depth: 8 }));
    expect(readImageSize(png.subarray(0, 20))).toBeNull();
    expect(readImageSize(Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10]))).toBeNull();
    expect(readImageSize(Buffer.from([0xff, 0xd8, 0xff, 0xd9]))).toBeNull();
    expect(readImageSize(new Uint8Array(0))).toBeNull();
  });
});

describe('firmContactLines', () => {
  it('puts the address on one line, then phone · e-mail · website, then the licences, leaving blanks out', () => {
    expect(
      firmContactLines({ address: 'PO Box 214\n Gays Mills, WI 54631\n', phone: '608-555-0142', email: null, website: 'https://example.com/', licenceNumbers: 'Applicator #1\nBurn manager #2' }),
    ).toEqual(['PO Box 214, Gays Mills, WI 54631', '608-555-0142  ·  example.com', 'Applicator #1  ·  Burn manager #2']);
    expect(firmContactLines({ phone: '  ', email: 'office@example.com' })).toEqual(['office@example.com']);
    expect(firmContactLines({})).toEqual([]);
  });
});
