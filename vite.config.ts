import { defineConfig } from 'vite';
import vue from '@vitejs/plugin-vue';
import Components from 'unplugin-vue-components/vite';
import { AntDesignVueResolver } from 'unplugin-vue-components/resolvers';

// ant-design-vue components are imported on demand (only where a template uses them),
// so the public board page's chunk never pulls the component library.
export default defineConfig({
  plugins: [
    vue(),
    Components({ resolvers: [AntDesignVueResolver({ importStyle: false, resolveIcons: true })], dts: 'components.d.ts', dirs: [] }),
  ],
  server: {
    port: 5173,
    proxy: { '/api': `http://127.0.0.1:${process.env.PORT ?? 3000}` },
  },
  build: { outDir: 'dist', chunkSizeWarningLimit: 1500 },
});
