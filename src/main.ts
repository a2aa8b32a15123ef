// Client entry: Vue with Pinia, the router and Vuetify themed with StandGraze's palette; fonts shipped with the app.
import { createApp } from 'vue'
import { createPinia } from 'pinia'
import '../fonts/roboto.css'
import './styles/app.css'
import App from './App.vue'
import { createAppRouter } from './router/index'
import { createAppVuetify } from './plugins/vuetify'
import { setUnauthorizedHandler } from './api/client'
import { useSessionStore } from './stores/session'

const app = createApp(App)
const pinia = createPinia()
app.use(pinia)
const router = createAppRouter()
app.use(router)
app.use(createAppVuetify())

setUnauthorizedHandler(() => {
  const session = useSessionStore(pinia)
  if (!session.me) return
  session.forget()
  if (!router.currentRoute.value.meta.public) void router.push({ name: 'sign-in', query: { next: router.currentRoute.value.fullPath } })
})

app.mount('#app')
