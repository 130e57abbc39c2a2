import { createApp } from 'vue';
import { createPinia } from 'pinia';
import '@fontsource/dejavu-sans/400.css';
import '@fontsource/dejavu-sans/700.css';
import './styles/base.css';
import App from './App.vue';
import { router } from './router/index.js';
import { installRouteGuards } from './router/guard.js';

const pinia = createPinia();
installRouteGuards(router, pinia);
createApp(App).use(pinia).use(router).mount('#app');
