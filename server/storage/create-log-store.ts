import type { Config } from '../config/config';
import { createLocalLogStore } from './local-log-store';
import type { LogStore } from './log-store';
import { createS3LogStore } from './s3-log-store';

/** The store the configuration names (BELLKEEP_STORAGE): the one place that chooses. */
export function createLogStore(config: Pick<Config, 'storage' | 'dataDir'>): LogStore {
  return config.storage.kind === 's3' ? createS3LogStore(config.storage) : createLocalLogStore(config.dataDir);
}
