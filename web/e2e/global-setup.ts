import type { TestProject } from 'vitest/node';
import { startOwnStack } from './own-stack';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

/** One API for the journeys, on the database provenote_e2e loaded with the demo lab; stopped after them. */
export default async function setup(project: TestProject) {
  const stack = await startOwnStack('provenote_e2e');
  project.provide('baseUrl', stack.baseUrl);
  return stack.stop;
}
