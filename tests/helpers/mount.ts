// Mounts a component with the real Vuetify theme, a fresh Pinia and a memory-history router.
import { mount, type ComponentMountingOptions } from '@vue/test-utils'
import { createPinia, setActivePinia } from 'pinia'
import { createMemoryHistory } from 'vue-router'
import type { Component } from 'vue'
import { createAppVuetify } from '../../src/plugins/vuetify'
import { createAppRouter } from '../../src/router/index'

export function setupPlugins() {
  const pinia = createPinia()
  setActivePinia(pinia)
  const router = createAppRouter(createMemoryHistory())
  const vuetify = createAppVuetify()
  return { pinia, router, vuetify }
}

export function mountWithApp<C extends Component>(component: C, options: ComponentMountingOptions<C> = {} as ComponentMountingOptions<C>) {
  const { pinia, router, vuetify } = setupPlugins()
  const wrapper = mount(component, { ...options, global: { plugins: [pinia, router, vuetify], ...(options.global ?? {}) } } as ComponentMountingOptions<C>)
  return { wrapper, pinia, router }
}
