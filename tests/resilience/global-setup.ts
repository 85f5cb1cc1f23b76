/**
 * The resilience project's shared PostgreSQL: a cluster of its own (.data/pg-resilience-<pid>-shared,
 * port 54359 or the next free one), with a migrated template that test files copy into fresh
 * databases. Stopped and deleted after the run. The restart test starts a second cluster of its
 * own, since it stops and starts the server.
 */
import type { TestProject } from 'vitest/node';
import { migrate, startOwnCluster } from './cluster';

export default async function setup(project: TestProject) {
  const own = await startOwnCluster('shared', 54359);
  const template = 'seepwise_resilience_template';
  await migrate(own.createDatabase(template));
  project.provide('resiliencePgPort', own.cluster.port);
  project.provide('resilienceTemplate', template);
  return () => own.destroy();
}
