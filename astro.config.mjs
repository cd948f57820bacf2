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
  security: { checkOrigin: true },
  vite: {
    plugins: [tailwindcss()],
    ssr: { external: ['@electric-sql/pglite', 'pg', '@node-rs/argon2', 'smtp-server', 'nodemailer', 'mailparser', 'pdfkit', 'exceljs'] },
  },
});
