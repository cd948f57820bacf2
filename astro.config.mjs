// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwindcss from '@tailwindcss/vite';

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  integrations: [react()],
  server: { host: process.env.HOST ?? 'localhost', port: Number(process.env.PORT ?? 4321) },
  // Cross-site request checks are done in src/middleware.ts against the configured origins at run
  // time (Astro's own check needs the public host fixed at build time).
  security: { checkOrigin: false },
  vite: {
    plugins: [tailwindcss()],
    ssr: { external: ['@electric-sql/pglite', 'pg', '@node-rs/argon2', 'smtp-server', 'nodemailer', 'mailparser', 'pdfkit', 'exceljs'] },
  },
});
