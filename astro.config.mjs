// @ts-check
import mdx from '@astrojs/mdx';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'astro/config';
import remarkMath from 'remark-math';
import { renderMath } from './src/lib/markdown/renderMath.ts';

/** Method notes and guides typeset math with the case pipeline's KaTeX (the stylesheet's version). */
const rehypeCaseMath = () => (/** @type {import('hast').Root} */ tree) => renderMath(tree);

// Host names the server believes in the Host header (Astro ignores any other, which would
// break the same-origin check of form posts). Loopback for the local app and tests, plus
// the host of SEQUENT_BASE_URL when a deployment builds with it set.
const allowedDomains = [{ hostname: '127.0.0.1' }, { hostname: 'localhost' }];
if (process.env.SEQUENT_BASE_URL) allowedDomains.push({ hostname: new URL(process.env.SEQUENT_BASE_URL).hostname });

export default defineConfig({
  output: 'server',
  // Middleware mode: scripts/serve.mjs is the HTTP server and serves dist/client itself.
  adapter: node({ mode: 'middleware' }),
  integrations: [react(), mdx()],
  // Method notes and guides in content/ are markdown with KaTeX math.
  markdown: { remarkPlugins: [remarkMath], rehypePlugins: [rehypeCaseMath], shikiConfig: { theme: 'github-light' } },
  server: { host: '127.0.0.1', port: 4321 },
  // Rejects cross-site form posts to on-demand pages (CSRF); JSON APIs rely on CORS.
  security: { checkOrigin: true, allowedDomains },
  vite: {
    plugins: [tailwindcss()],
  },
});
