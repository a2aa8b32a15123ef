// The signed-in user, their operations and roles, the chosen operation and the unit system.
import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import { authApi } from '@/api/auth'
import type { Me, SignInInput, SignUpInput } from '@shared/schemas/auth'
import { can, type Permission } from '@shared/schemas/roles'
import type { UnitSystem } from '@shared/schemas/common'

const LAST_OP_KEY = 'standgraze.lastOperation'

export const useSessionStore = defineStore('session', () => {
  const me = ref<Me | null>(null)
  const loaded = ref(false)
  const currentOperationId = ref<number | null>(null)

  const memberships = computed(() => me.value?.memberships ?? [])
  const currentMembership = computed(() => memberships.value.find((m) => m.operationId === currentOperationId.value) ?? null)
  const role = computed(() => currentMembership.value?.role ?? null)
  const unitSystem = computed<UnitSystem>(() => me.value?.unitSystem ?? 'us')

  function allowed(permission: Permission) {
    return can(role.value, permission)
  }

  function pickDefaultOperation() {
    const saved = Number(localStorage.getItem(LAST_OP_KEY))
    const ids = memberships.value.map((m) => m.operationId)
    currentOperationId.value = ids.includes(saved) ? saved : (ids[0] ?? null)
  }

  function selectOperation(id: number) {
    if (!memberships.value.some((m) => m.operationId === id)) return false
    currentOperationId.value = id
    localStorage.setItem(LAST_OP_KEY, String(id))
    return true
  }

  function accept(user: Me) {
    me.value = user
    loaded.value = true
    if (!memberships.value.some((m) => m.operationId === currentOperationId.value)) pickDefaultOperation()
  }

  async function load() {
    try {
      const user = await authApi.session()
      if (user) accept(user)
      else me.value = null
    } catch {
      me.value = null
    } finally {
      loaded.value = true
    }
  }

  async function signIn(input: SignInInput) {
    accept(await authApi.signIn(input))
  }
  async function signUp(input: SignUpInput) {
    accept(await authApi.signUp(input))
  }
  async function signOut() {
    try {
      await authApi.signOut()
    } finally {
      me.value = null
      currentOperationId.value = null
    }
  }
  async function setUnits(u: UnitSystem) {
    accept(await authApi.setUnits(u))
  }
  function forget() {
    me.value = null
  }

  return { me, loaded, currentOperationId, memberships, currentMembership, role, unitSystem, allowed, selectOperation, accept, load, signIn, signUp, signOut, setUnits, forget }
})
