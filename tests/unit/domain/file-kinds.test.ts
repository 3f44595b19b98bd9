import { describe, expect, it } from 'vitest';
import { decideFileKind, downloadName, extensionOf, isPlainUtf8Text } from '../../../shared/domain/file-kinds';

const bytes = (s: string) => new TextEncoder().encode(s);

// Check values are common practice, no source, unless a source is named beside them.
describe('decideFileKind', () => {
  it('keeps sniffed PDF, PNG, JPEG and WebP whatever the name says', () => {
    // The sniffer's ext/mime pairs as file-type 21 reports them (file-type README, "Supported file types").
    expect(decideFileKind(bytes('%PDF-1.7'), { ext: 'pdf', mime: 'application/pdf' }, 'x.txt')).toMatchObject({ ok: true, kind: 'pdf', contentType: 'application/pdf' });
    expect(decideFileKind(bytes('x'), { ext: 'png', mime: 'image/png' }, null)).toMatchObject({ ok: true, extension: 'png' });
    expect(decideFileKind(bytes('x'), { ext: 'jpg', mime: 'image/jpeg' }, 'a.jpeg')).toMatchObject({ ok: true, contentType: 'image/jpeg' });
    expect(decideFileKind(bytes('x'), { ext: 'webp', mime: 'image/webp' }, 'a')).toMatchObject({ ok: true, kind: 'webp' });
  });

  it('refuses sniffed executables, archives and other binaries, naming what was found', () => {
    const exe = decideFileKind(bytes('MZ'), { ext: 'exe', mime: 'application/x-msdownload' }, 'report.pdf');
    expect(exe).toMatchObject({ ok: false });
    expect(!exe.ok && exe.message).toMatch(/EXE file .*Upload a PDF/);
    expect(decideFileKind(bytes('PK'), { ext: 'zip', mime: 'application/zip' }, 'a.csv').ok).toBe(false);
    expect(decideFileKind(bytes('GIF89a'), { ext: 'gif', mime: 'image/gif' }, 'a.gif').ok).toBe(false);
  });

  it('accepts text only when named .csv or .txt, UTF-8 and free of markup', () => {
    expect(decideFileKind(bytes('unit,acres\nNorth,2.4\n'), undefined, 'Acres.CSV')).toMatchObject({ ok: true, kind: 'csv', contentType: 'text/csv; charset=utf-8' });
    expect(decideFileKind(bytes('Gate code 1234.\r\n\tThanks — Priya'), undefined, 'note.txt')).toMatchObject({ ok: true, kind: 'txt' });
    expect(decideFileKind(bytes('plain words'), undefined, 'page.html').ok).toBe(false);
    expect(decideFileKind(bytes('plain words'), undefined, 'no-extension').ok).toBe(false);
    for (const markup of ['<!doctype html><p>hi', '<svg xmlns="http://www.w3.org/2000/svg"/>', '  <script>x()</script>', '<?xml version="1.0"?>', 'a,<iframe src=x>', 'x,javascript:alert(1)', '<!-- hidden -->']) {
      const d = decideFileKind(bytes(markup), undefined, 'data.csv');
      expect(d.ok, markup).toBe(false);
    }
    // Less-than signs in ordinary data are fine ("pH < 6" is a common soil-test note, no source).
    expect(decideFileKind(bytes('sample,note\n1,pH < 6 so lime\n'), undefined, 'soil.csv').ok).toBe(true);
  });

  it('refuses empty files and text with control characters or invalid UTF-8', () => {
    expect(decideFileKind(new Uint8Array(), undefined, 'a.txt')).toMatchObject({ ok: false });
    expect(decideFileKind(new Uint8Array([0x61, 0x00, 0x62]), undefined, 'a.txt').ok).toBe(false);
    // 0xC3 0x28 is an invalid two-byte sequence (Unicode 15, Table 3-7 well-formed UTF-8).
    expect(decideFileKind(new Uint8Array([0xc3, 0x28]), undefined, 'a.csv').ok).toBe(false);
  });
});

describe('helpers', () => {
  it('reads extensions and text', () => {
    expect(extensionOf('Report.PDF')).toBe('pdf');
    expect(extensionOf('archive.tar.gz')).toBe('gz');
    expect(extensionOf('README')).toBe('');
    expect(isPlainUtf8Text(bytes('é and ü'))).toBe(true);
    expect(isPlainUtf8Text(new Uint8Array([0x1b, 0x5b]))).toBe(false);
  });

  it('makes safe download names with the stored extension', () => {
    expect(downloadName('Soil test — Ridge plot (2026)', 'pdf')).toBe('Soil test Ridge plot 2026.pdf'); // common practice, no source
    expect(downloadName('map.pdf', 'pdf')).toBe('map.pdf'); // common practice, no source
    expect(downloadName('"; rm -rf /', 'txt')).toBe('rm -rf.txt'); // quotes, semicolons and slashes dropped (RFC 6266 §4.3: no path separators)
    expect(downloadName('', 'png')).toBe('file.png'); // common practice, no source
  });
});
