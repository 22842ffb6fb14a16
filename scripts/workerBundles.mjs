// The Web Workers' bundles (the meter's and the frame's: Metro bundles no workers), built with esbuild and the
// same stand-ins metro.config.js gives the pages on the web: zod's table of every language's messages is an empty
// module, and its JSON Schema conversion and `z.compile` come from web/zodWithoutJsonSchema.js. Without them
// the meter's worker was 612 KB raw, 447 KB of it zod (128 KB as sent; about 0.85 s on the phone profile's line).
import { join } from 'node:path';

const zodWebOnly = /^\.\.?\/(core\/)?(compile|to-json-schema|json-schema-processors|json-schema-generator|from-json-schema)\.js$/;
const inZod = /[\\/]node_modules[\\/]zod[\\/]/;
const inZodV4 = /[\\/]node_modules[\\/]zod[\\/]v4[\\/]/;

/** esbuild plugin: metro.config.js's web stand-ins for zod. */
export function zodForBrowsers(root) {
  const standIn = join(root, 'web', 'zodWithoutJsonSchema.js');
  return {
    name: 'zod-for-browsers',
    setup(build) {
      build.onResolve({ filter: /\/locales\/index(\.c?js)?$/ }, (a) => (inZod.test(a.importer) ? { path: a.path, namespace: 'falloff-empty' } : undefined));
      build.onResolve({ filter: zodWebOnly }, (a) => (inZodV4.test(a.importer) ? { path: standIn } : undefined));
      build.onLoad({ filter: /.*/, namespace: 'falloff-empty' }, () => ({ contents: 'export {};', loader: 'js' }));
    },
  };
}

/** Bundles one worker (`entry`, relative to `root`) into `outfile`, minified ES modules. Returns its size. */
export async function bundleWorker({ root, entry, outfile }) {
  const esbuild = await import('esbuild');
  const r = await esbuild.build({
    absWorkingDir: root,
    entryPoints: [entry],
    bundle: true,
    format: 'esm',
    minify: true,
    target: 'es2022',
    outfile,
    logLevel: 'warning',
    metafile: true,
    plugins: [zodForBrowsers(root)],
  });
  return Object.values(r.metafile.outputs).reduce((n, o) => n + o.bytes, 0);
}
