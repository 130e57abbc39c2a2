/**
 * The store library joins the app on the first screen that needs it. The public board page uses
 * no store, so a visitor scanning a tag on a weak signal never downloads it (~6 KB compressed).
 * Installing Pinia after mount is sound: a component made later finds it through the app's provides.
 */
import type { App } from 'vue';
import type { Pinia } from 'pinia';

let installing: Promise<Pinia> | null = null;

export function installPinia(app: App): Promise<Pinia> {
  installing ??= import('pinia').then(({ createPinia }) => {
    const pinia = createPinia();
    app.use(pinia);
    return pinia;
  });
  return installing;
}
