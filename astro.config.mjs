// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwindcss from '@tailwindcss/vite';
import { CSP_DIRECTIVES } from './src/server/csp.ts';

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  integrations: [react()],
  server: { host: process.env.HOST ?? 'localhost', port: Number(process.env.PORT ?? 4321) },
  // Cross-site request checks are done in src/middleware.ts against the configured origins at run
  // time (Astro's own check needs the public host fixed at build time).
  security: { checkOrigin: false },
  // Content-Security-Policy (OWASP ASVS 4.0.3 14.4.3): Astro hashes the scripts it renders, so
  // script-src allows no inline script but those. Style attributes written by server-rendered
  // islands (chart sizes, virtual rows) need 'unsafe-inline' for styles, which only counts while
  // no style hash is listed: stylesheets are therefore never inlined. See
  // docs/decisions/0008-content-security-policy.md.
  build: { inlineStylesheets: 'never' },
  experimental: {
    csp: {
      algorithm: 'SHA-256',
      directives: [...CSP_DIRECTIVES],
      styleDirective: { resources: ["'self'", "'unsafe-inline'"] },
    },
  },
  vite: {
    plugins: [tailwindcss()],
    ssr: { external: ['@electric-sql/pglite', 'pg', '@node-rs/argon2', 'smtp-server', 'nodemailer', 'mailparser', 'pdfkit', 'exceljs'] },
  },
});
