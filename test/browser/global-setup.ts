// Once per browser-test run: build the app, serve it with `vite preview`, hand the address to
// the tests through provide/inject, and stop the server afterwards.
import type { TestProject } from 'vitest/node';
import { buildApp, startPreview, testDistDir } from './server';

declare module 'vitest' {
  export interface ProvidedContext {
    /** Address of the shared preview server, ending in "/". */
    baseUrl: string;
    /** The built app, for tests that start a preview server of their own. */
    distDir: string;
  }
}

export default async function setup(project: TestProject) {
  buildApp(testDistDir);
  const server = await startPreview(testDistDir);
  project.provide('baseUrl', server.url);
  project.provide('distDir', testDistDir);
  return async () => {
    await server.stop();
  };
}
