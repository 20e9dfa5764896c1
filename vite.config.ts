/**
 * Vite configuration for the Loopwright studio (the browser client in src/).
 *
 * - React (Fast Refresh) and Tailwind CSS 4 through their Vite plugins; the
 *   Tailwind theme lives in tailwind.config.ts, wired in from src/styles/app.css
 *   with the `@config` directive.
 * - `npm run dev`: dev server on 127.0.0.1:5173, `/api` proxied to the Express
 *   app on 127.0.0.1:4310 (the port `npm start` uses by default).
 * - `vite build` writes dist/, which Express serves. Pages are lazy route
 *   modules (see src/router.tsx), so the first load carries only the shell,
 *   the sign-in and library pages; the editor, the compiler and its worker
 *   load with the workspace.
 */
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

// `vite build` always makes a production bundle, even when the calling
// process runs with NODE_ENV=development (npm start) or test (npm test):
// Vite otherwise keeps that NODE_ENV and bundles React's development build.
if (process.argv.includes('build')) process.env.NODE_ENV = 'production';

export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: {
    // culori's main entry registers every colour space it knows; the browser
    // gets the tree-shakeable build with the spaces patterns use (see the file).
    alias: [{ find: /^culori$/, replacement: fileURLToPath(new URL('./src/vendor/culori-browser.ts', import.meta.url)) }],
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    strictPort: true,
    proxy: { '/api': { target: 'http://127.0.0.1:4310', changeOrigin: false } },
  },
  worker: { format: 'es' },
  // Only for `vite build`: the studio uses the plain compiler, so the trace
  // recording of the incremental one is compiled out of the compile worker
  // (`TRACED` in shared/check/context.ts, __LW_NO_TRACE__).
  define: process.argv.includes('build') ? { __LW_NO_TRACE__: 'true' } : {},
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    target: 'es2022',
    sourcemap: false,
    // Fonts are small woff2 files; keep them as files rather than inlined.
    assetsInlineLimit: 0,
    reportCompressedSize: true,
    // dist/.vite/manifest.json maps each page to its chunks; the bundle-size
    // measurement (tests/e2e/bundle-size.ts) reads it.
    manifest: true,
  },
});
