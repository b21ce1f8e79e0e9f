import { createApp } from 'vue';
import { createPinia } from 'pinia';
import '@fontsource/ibm-plex-sans/400.css';
import '@fontsource/ibm-plex-sans/500.css';
import '@fontsource/ibm-plex-sans/600.css';
import '@fontsource/ibm-plex-mono/400.css';
import '@fontsource/ibm-plex-mono/500.css';
import './assets/base.css';
import App from './App.vue';
import { installNaiveStyleOrder } from './plugins/naive';
import { router } from './router';

installNaiveStyleOrder();
const app = createApp(App);
app.use(createPinia());
app.use(router);
app.mount('#app');
