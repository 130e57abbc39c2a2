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
        // Chunks by how often they change, so a release of one screen costs a repeat visitor that screen's
        // chunk and the small entry (~45 KB for the editor), not the framework too: Vue and its router (the
        // board page's only library); the rule checks; every other library (the component library, the
        // virtual list) as one chunk the signed-in screens share, ~220 KB compressed, fetched once a release
        // of a library; and the few ~1 KB modules every screen shares (the HTTP helper, Vue's SFC helper,
        // the board picture's rows) as one file rather than four, each costing headers and a round trip.
        codeSplitting: {
          groups: [
            { name: 'vue', test: /node_modules[\\/](@vue|vue|vue-router)[\\/]/, priority: 30 },
            { name: 'rules', test: /[\\/]shared[\\/]rules[\\/]/, priority: 20 },
            { name: 'ui', test: /node_modules[\\/]/, priority: 15 },
            { name: 'common', test: /(rolldown[:/]runtime|plugin-vue:export-helper|src\/api\/http\.ts|din-rows\.ts)/, priority: 10 },
          ],
        },
      },
    },
  },
});
