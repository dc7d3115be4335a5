/** Registers every plugin on the app: Vuetify, Pinia, the router. */
import type { App } from 'vue';
import { createPinia } from 'pinia';
import { vuetify } from './vuetify.js';
import { router } from '../router/index.js';

export function registerPlugins(app: App): void {
  app.use(vuetify).use(createPinia()).use(router);
}
