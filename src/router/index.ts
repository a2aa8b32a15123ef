// The explicit route table and its guards: sign-in required, operation membership, role permissions, admin pages.
import { createRouter, createWebHistory, type RouteRecordRaw, type RouterHistory } from 'vue-router'
import { useSessionStore } from '@/stores/session'
import { navItems } from '@/navigation'
import type { Permission } from '@shared/schemas/roles'
import { nutritionPages } from './nutritionPages'
import { grazingPages } from './grazingPages'

declare module 'vue-router' {
  interface RouteMeta {
    public?: boolean
    admin?: boolean
    permission?: Permission
    title?: string
  }
}

export const builtPages: Record<string, () => Promise<unknown>> = {
  ...nutritionPages,
  ...grazingPages,
  team: () => import('@/pages/TeamPage.vue'),
}

const operationChildren: RouteRecordRaw[] = navItems.map((item) => ({
  path: item.name,
  name: item.name,
  component: builtPages[item.name] ?? (() => import('@/pages/NotYetPage.vue')),
  meta: { permission: item.permission, title: item.title },
}))

export const routes: RouteRecordRaw[] = [
  { path: '/', name: 'home', component: () => import('@/pages/HomeRedirect.vue') },
  { path: '/sign-in', name: 'sign-in', component: () => import('@/pages/SignInPage.vue'), meta: { public: true, title: 'Sign in' } },
  { path: '/sign-up', name: 'sign-up', component: () => import('@/pages/SignUpPage.vue'), meta: { public: true, title: 'Create an account' } },
  { path: '/forgot-password', name: 'forgot-password', component: () => import('@/pages/ForgotPasswordPage.vue'), meta: { public: true, title: 'Reset password' } },
  { path: '/reset-password', name: 'reset-password', component: () => import('@/pages/ResetPasswordPage.vue'), meta: { public: true, title: 'Choose a new password' } },
  { path: '/accept-invite', name: 'accept-invite', component: () => import('@/pages/AcceptInvitePage.vue'), meta: { public: true, title: 'Invitation' } },
  { path: '/account', name: 'account', component: () => import('@/pages/AccountPage.vue'), meta: { title: 'Your account' } },
  { path: '/operations', name: 'operations', component: () => import('@/pages/OperationsPage.vue'), meta: { title: 'Operations' } },
  { path: '/admin/users', name: 'admin-users', component: () => import('@/pages/AdminUsersPage.vue'), meta: { admin: true, title: 'Users' } },
  { path: '/admin/mail', name: 'admin-mail', component: () => import('@/pages/AdminMailPage.vue'), meta: { admin: true, title: 'Outgoing mail' } },
  { path: '/o/:operationId(\\d+)', component: () => import('@/layouts/OperationLayout.vue'), children: [{ path: '', redirect: { name: 'today' } }, ...operationChildren] },
  { path: '/:pathMatch(.*)*', name: 'not-found', component: () => import('@/pages/NotFoundPage.vue'), meta: { public: true, title: 'Not found' } },
]

export function createAppRouter(history: RouterHistory = createWebHistory()) {
  const router = createRouter({ history, routes })
  router.beforeEach(async (to) => {
    const session = useSessionStore()
    if (!session.loaded) await session.load()
    if (to.meta.public) return true
    if (!session.me) return { name: 'sign-in', query: { next: to.fullPath } }
    if (to.meta.admin && !session.me.isAdmin) return { name: 'home' }
    const opParam = to.params.operationId
    if (opParam !== undefined) {
      const id = Number(opParam)
      if (!session.selectOperation(id)) return { name: 'not-found', params: { pathMatch: to.path.slice(1).split('/') } }
      if (to.meta.permission && !session.allowed(to.meta.permission)) return { name: 'today', params: { operationId: id } }
    }
    return true
  })
  router.afterEach((to) => {
    document.title = to.meta.title ? `${to.meta.title} · StandGraze` : 'StandGraze'
  })
  return router
}
