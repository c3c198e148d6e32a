// @ts-check
import { defineConfig, envField } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwind from '@astrojs/tailwind';

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
