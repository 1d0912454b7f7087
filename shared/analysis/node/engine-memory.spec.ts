import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ENGINE_MALLOC_TUNABLES, withEngineMemory } from './engine-memory';

describe("the engine's allocator settings", () => {
  it('are added to an environment without tunables, appended to other tunables, and kept when already set', () => {
    expect(withEngineMemory({ PATH: '/bin' })).toEqual({ PATH: '/bin', GLIBC_TUNABLES: ENGINE_MALLOC_TUNABLES });
    expect(withEngineMemory({ GLIBC_TUNABLES: 'glibc.malloc.arena_max=2' }).GLIBC_TUNABLES).toBe(`glibc.malloc.arena_max=2:${ENGINE_MALLOC_TUNABLES}`);
    expect(withEngineMemory({ GLIBC_TUNABLES: 'glibc.malloc.trim_threshold=0' }).GLIBC_TUNABLES).toBe('glibc.malloc.trim_threshold=0');
  });

  it('are what the package scripts that run the engine or take uploads (the census) set', () => {
    const scripts = (JSON.parse(readFileSync(join(__dirname, '..', '..', '..', 'package.json'), 'utf8')) as { scripts: Record<string, string> }).scripts;
    for (const name of ['analyse', 'verify', 'worker', 'api']) expect(scripts[name]).toMatch(new RegExp(`^GLIBC_TUNABLES=${ENGINE_MALLOC_TUNABLES} node `));
  });
});
