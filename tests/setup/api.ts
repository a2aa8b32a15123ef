// API tests run against a real PostgreSQL database; `npm test` creates a throwaway one and passes its URL.
if (!process.env.DATABASE_URL) {
  throw new Error('DATABASE_URL is not set: run API tests through `npm test` or `npm run test:api`, which start a throwaway database.')
}
