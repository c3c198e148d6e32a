// @ts-check
import { defineConfig, envField } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwind from '@astrojs/tailwind';
import { fileURLToPath } from 'node:url';

// @react-three/fiber's `import * as THREE` keeps all of three.js in the bundle, so fiber alone is given a subset.
const threeSubset = fileURLToPath(new URL('./src/components/trainer/scene/three-subset.ts', import.meta.url));
/** @type {import('vite').Plugin} */
const threeSubsetForFiber = {
  name: 'three-subset-for-fiber',
  apply: 'build',
  enforce: 'pre',
  resolveId(source, importer) {
    if (source === 'three' && importer && /[\\/]node_modules[\\/]@react-three[\\/]fiber[\\/]/.test(importer)) return threeSubset;
    return null;
  },
};

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  integrations: [react(), tailwind({ applyBaseStyles: false })],
  security: {
    // Refuse cross-origin form posts (on by default for server output; stated for the reader).
    checkOrigin: true,
    // Host headers Astro may trust when it builds request URLs (the origin check compares against them).
    // A deployment names its public host at build time with PUBLIC_HOSTNAME.
    allowedDomains: [
      { hostname: 'localhost' },
      { hostname: '127.0.0.1' },
      ...(process.env.PUBLIC_HOSTNAME ? [{ hostname: process.env.PUBLIC_HOSTNAME, protocol: 'https' }] : []),
    ],
  },
  server: { host: '127.0.0.1', port: 4321 },
  vite: { plugins: [threeSubsetForFiber] },
  env: {
    schema: {
      DATABASE_URL: envField.string({ context: 'server', access: 'secret' }),
      // Behind a reverse proxy the client address comes from X-Forwarded-For.
      TRUST_PROXY: envField.boolean({ context: 'server', access: 'secret', default: false }),
      // Secure cookies need HTTPS; a plain-HTTP deployment other than localhost may turn them off.
      COOKIE_SECURE: envField.boolean({ context: 'server', access: 'secret', optional: true }),
    },
  },
});
