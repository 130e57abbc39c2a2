import { defineConfig } from 'vite';
import vue from '@vitejs/plugin-vue';
import Components from 'unplugin-vue-components/vite';
import { AntDesignVueResolver } from 'unplugin-vue-components/resolvers';
import { compression } from 'vite-plugin-compression2';

// ant-design-vue components are imported on demand (only where a template uses them),
// so the public board page's chunk never pulls the component library.
// Each text file of the build gets a brotli (.br) and a gzip (.gz) twin at the highest levels, made once
// here so the server only picks one per request (server/http/static.ts); fonts and images are left as they are.
export default defineConfig({
  plugins: [
    vue(),
    Components({ resolvers: [AntDesignVueResolver({ importStyle: false, resolveIcons: true })], dts: 'components.d.ts', dirs: [] }),
    compression({
      algorithms: ['brotliCompress', 'gzip'],
      include: /\.(html|js|mjs|css|json|svg|txt|webmanifest)$/,
      // A twin of a tiny file (under ~150 bytes) can be a few bytes larger; it is made anyway, so every text file goes out encoded.
      skipIfLargerOrEqual: false,
    }),
  ],
  server: {
    port: 5173,
    proxy: { '/api': `http://127.0.0.1:${process.env.PORT ?? 3000}` },
  },
  build: {
    outDir: 'dist',
    chunkSizeWarningLimit: 1500,
    rolldownOptions: {
      output: {
        // The bundler's runtime and the few small modules every screen shares (the HTTP helper, Vue's SFC
        // helper, the board picture's rows) would otherwise be four files of ~1 KB; on a weak signal each
        // file costs its headers and a round trip, so they travel as one.
        advancedChunks: {
          groups: [{ name: 'common', test: /(rolldown[:/]runtime|plugin-vue:export-helper|src\/api\/http\.ts|din-rows\.ts)/ }],
        },
      },
    },
  },
});
