import path from 'node:path';
import type { TestProject } from 'vitest/node';

// Makes sure a PostgreSQL is available and tells the test files where (inject('adminUrl')).
// `npm test` passes TAPLINE_TEST_ADMIN_URL; a bare `npx vitest` starts the local cluster itself
// (and leaves it running for the next run; `npm test` stops what it started).
export default async function setup(project: TestProject): Promise<void> {
  let adminUrl = process.env.TAPLINE_TEST_ADMIN_URL;
  if (!adminUrl) {
    const root = path.resolve(import.meta.dirname, '../..');
    // @ts-expect-error plain-JS set-up module shared with `npm start`
    const { prepareDatabase } = await import('../../scripts/lib/database.mjs');
    const db = await prepareDatabase(root, 'tapline_test');
    adminUrl = db.adminUrl as string;
  }
  project.provide('adminUrl', adminUrl);
}

declare module 'vitest' {
  export interface ProvidedContext {
    adminUrl: string;
  }
}
