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
      // Outgoing mail: the school's SMTP relay (locally, the mail catcher that setup starts).
      SMTP_HOST: envField.string({ context: 'server', access: 'secret', default: '127.0.0.1' }),
      SMTP_PORT: envField.number({ context: 'server', access: 'secret', default: 2525 }),
      SMTP_USER: envField.string({ context: 'server', access: 'secret', optional: true }),
      SMTP_PASSWORD: envField.string({ context: 'server', access: 'secret', optional: true }),
      MAIL_FROM: envField.string({ context: 'server', access: 'secret', default: 'Benchwright <no-reply@benchwright.example>' }),
      // Only where mail goes to the local catcher: admins may read what was sent (the demo shows it).
      MAIL_CATCHER_URL: envField.string({ context: 'server', access: 'secret', optional: true }),
      // Links in e-mail; a request's own origin is used when the app is answering one.
      APP_URL: envField.string({ context: 'server', access: 'secret', optional: true }),
      // Uploads: any S3-compatible store (locally, the S3 fake that setup starts).
      S3_ENDPOINT: envField.string({ context: 'server', access: 'secret', optional: true }),
      S3_REGION: envField.string({ context: 'server', access: 'secret', default: 'us-east-1' }),
      S3_BUCKET: envField.string({ context: 'server', access: 'secret', default: 'benchwright' }),
      S3_ACCESS_KEY_ID: envField.string({ context: 'server', access: 'secret', optional: true }),
      S3_SECRET_ACCESS_KEY: envField.string({ context: 'server', access: 'secret', optional: true }),
    },
  },
});
