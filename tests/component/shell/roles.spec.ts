// Shell components: error display with field messages, the role-aware Team page, and the not-yet empty state.
import { describe, expect, it, vi, afterEach } from 'vitest'
import { flushPromises } from '@vue/test-utils'
import { VApp } from 'vuetify/components'
import { defineComponent, h } from 'vue'
import ErrorAlert from '../../../src/components/ErrorAlert.vue'
import TeamPage from '../../../src/pages/TeamPage.vue'
import { ApiRequestError } from '../../../src/api/client'
import { useSessionStore } from '../../../src/stores/session'
import { mountWithApp } from '../../helpers/mount'
import type { Me } from '../../../shared/schemas/auth'

afterEach(() => {
  vi.unstubAllGlobals()
})

const me = (role: 'owner' | 'hand'): Me => ({
  id: 1,
  name: 'Test Person',
  email: 't@example.test',
  isAdmin: false,
  unitSystem: 'us',
  memberships: [{ operationId: 7, operationName: 'Test Op', role, isDemo: false }],
})

function stubFetch(body: unknown) {
  const fetchMock = vi.fn(async () => new Response(JSON.stringify(body), { status: 200, headers: { 'content-type': 'application/json' } }))
  vi.stubGlobal('fetch', fetchMock)
  return fetchMock
}

const inApp = (inner: ReturnType<typeof defineComponent>) => defineComponent({ render: () => h(VApp, null, { default: () => h(inner) }) })

describe('ErrorAlert', () => {
  it('when a validation error lists several fields, then each field is shown', () => {
    const err = new ApiRequestError({ status: 400, code: 'validation_failed', message: 'The request has 2 invalid fields', fields: [{ field: 'email', message: 'bad' }, { field: 'name', message: 'missing' }] })
    const { wrapper } = mountWithApp(ErrorAlert, { props: { error: err } })
    expect(wrapper.text()).toContain('email: bad')
    expect(wrapper.text()).toContain('name: missing')
  })
})

describe('TeamPage', () => {
  const team = { members: [{ id: 1, userId: 1, name: 'Test Person', email: 't@example.test', role: 'owner', since: '2026-01-01' }, { id: 2, userId: 2, name: 'Crew Member', email: 'c@example.test', role: 'hand', since: '2026-01-01' }], invitations: [] }

  it('when the user is an owner, then the invite form is shown', async () => {
    stubFetch(team)
    const { wrapper, pinia } = mountWithApp(inApp(TeamPage as never))
    const s = useSessionStore(pinia)
    s.accept(me('owner'))
    s.selectOperation(7)
    await flushPromises()
    expect(wrapper.find('[data-test=invite-submit]').exists()).toBe(true)
    expect(wrapper.text()).toContain('Crew Member')
  })

  it('when the user is a hand, then there is no invite form and roles are read-only', async () => {
    stubFetch(team)
    const { wrapper, pinia } = mountWithApp(inApp(TeamPage as never))
    const s = useSessionStore(pinia)
    s.accept(me('hand'))
    s.selectOperation(7)
    await flushPromises()
    expect(wrapper.find('[data-test=invite-submit]').exists()).toBe(false)
    expect(wrapper.text()).toContain('Hand')
  })
})
