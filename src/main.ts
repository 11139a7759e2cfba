import { createApp } from 'vue'
import { createPinia } from 'pinia'
import { Quasar, Notify, Dialog } from 'quasar'
import iconSet from 'quasar/icon-set/svg-material-icons'
import { matClose } from '@quasar/extras/material-icons'

import '@fontsource/lato/400.css'
import '@fontsource/lato/700.css'
import 'quasar/dist/quasar.css'
import './styles/app.css'

import App from './App.vue'
import { router } from './router/index.ts'
import { BRAND_COLOURS } from './styles/brand.ts'

createApp(App)
  .use(createPinia())
  .use(router)
  .use(Quasar, {
    plugins: { Notify, Dialog },
    iconSet,
    config: {
      brand: { ...BRAND_COLOURS },
      notify: {
        position: 'top-right',
        timeout: 5000,
        actions: [{ icon: matClose, color: 'white', round: true, dense: true }],
      },
    },
  })
  .mount('#app')
