import { releaseTestCluster } from './database-setup';

export default function tearDownTestCluster(): void {
  releaseTestCluster();
}
