/**
 * A small build step: writes a brotli (`.br`) and a gzip (`.gz`) twin beside every text asset of
 * dist/assets, which the server sends as they are (server/middlewares/static-assets.ts) — the
 * strongest compression, paid once at build time instead of on every request.
 */
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import type { Plugin } from 'vite';

const TEXT = /\.(js|mjs|css|svg|json|txt|html|webmanifest)$/;

/** Compresses the text files of one folder; answers how many it wrote. */
export function precompressFolder(dir: string): number {
  let count = 0;
  for (const name of fs.readdirSync(dir)) {
    if (!TEXT.test(name)) continue;
    const file = path.join(dir, name);
    const bytes = fs.readFileSync(file);
    fs.writeFileSync(`${file}.br`, zlib.brotliCompressSync(bytes, { params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 11, [zlib.constants.BROTLI_PARAM_SIZE_HINT]: bytes.length } }));
    fs.writeFileSync(`${file}.gz`, zlib.gzipSync(bytes, { level: 9 }));
    count += 1;
  }
  return count;
}

/** The Vite plugin: after the bundle is written, pre-compresses dist/assets. */
export function precompressAssets(): Plugin {
  let outDir = 'dist';
  return {
    name: 'browseline-precompress',
    apply: 'build',
    enforce: 'post',
    configResolved(config) {
      outDir = path.resolve(config.root, config.build.outDir);
    },
    closeBundle() {
      const assets = path.join(outDir, 'assets');
      if (fs.existsSync(assets)) precompressFolder(assets);
    },
  };
}
