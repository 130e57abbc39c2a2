import { createApp } from 'vue';
import './styles/fonts.css';
import './styles/base.css';
import App from './App.vue';
import { router } from './router/index.js';
import { installRouteGuards } from './router/guard.js';
import { watchComboboxes } from './components/app/comboboxAria.js';
import { installPinia } from './stores/pinia.js';

// Every select's combobox input, on every screen, says whether it is open and carries its name.
watchComboboxes(document.body);
const app = createApp(App).use(router);
installRouteGuards(router, () => installPinia(app));
// Mount once the first route is resolved (the sign-in check may take a moment), so the page
// shows index.html's loading line instead of a blank screen meanwhile.
void router
  .isReady()
  .catch(() => undefined)
  .then(() => app.mount('#app'));
