import { createApp } from 'vue';
import { createPinia } from 'pinia';
import '@fontsource/dejavu-sans/400.css';
import '@fontsource/dejavu-sans/700.css';
import './styles/base.css';
import App from './App.vue';
import { router } from './router/index.js';
import { installRouteGuards } from './router/guard.js';
import { watchComboboxes } from './components/app/comboboxAria.js';

// Every select's combobox input, on every screen, says whether it is open and carries its name.
watchComboboxes(document.body);
const pinia = createPinia();
installRouteGuards(router, pinia);
const app = createApp(App).use(pinia).use(router);
// Mount once the first route is resolved (the sign-in check may take a moment), so the page
// shows index.html's loading line instead of a blank screen meanwhile.
void router
  .isReady()
  .catch(() => undefined)
  .then(() => app.mount('#app'));
