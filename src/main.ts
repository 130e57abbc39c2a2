import { createApp } from 'vue';
import { createPinia } from 'pinia';
import '@fontsource/dejavu-sans/400.css';
import '@fontsource/dejavu-sans/700.css';
import './styles/base.css';
import App from './App.vue';
import { router } from './router/index.js';

createApp(App).use(createPinia()).use(router).mount('#app');
