// Test projects: unit (engine, schemas), api (supertest on the real database), component (Vue + Vuetify in jsdom), browser (Chromium).
import { defineConfig, mergeConfig } from 'vitest/config'
import viteConfig from './vite.config.ts'

export default mergeConfig(
  viteConfig,
  defineConfig({
    test: {
      projects: [
        {
          extends: true,
          test: { name: 'unit', environment: 'node', include: ['tests/unit/**/*.spec.ts'], testTimeout: 60_000 },
        },
        {
          extends: true,
          test: {
            name: 'api',
            environment: 'node',
            include: ['tests/api/**/*.spec.ts'],
            setupFiles: ['tests/setup/api.ts'],
            fileParallelism: false,
            testTimeout: 30_000,
            hookTimeout: 60_000,
          },
        },
        {
          extends: true,
          test: {
            name: 'component',
            environment: 'jsdom',
            include: ['tests/component/**/*.spec.ts'],
            setupFiles: ['tests/setup/component.ts'],
            server: { deps: { inline: ['vuetify'] } },
          },
        },
        {
          extends: true,
          test: {
            name: 'browser',
            environment: 'node',
            include: ['tests/browser/**/*.spec.ts'],
            fileParallelism: false,
            testTimeout: 120_000,
            hookTimeout: 180_000,
          },
        },
      ],
    },
  }),
)
