/**
 * glibc's allocator settings for a process that runs the engine: keep freed memory instead of
 * handing it back to the kernel (trim threshold 1 GiB) and take it 64 MiB at a time (top pad).
 *
 * Why: every keystream refill is a fresh 64 KiB buffer from Node's cipher, freed by the next
 * garbage collection; with glibc's defaults the freed heap top goes back to the kernel, so the next
 * buffers fault their pages in again. On this project's virtual machine a page fault costs about
 * 10 µs: a 10^8-round analysis took 140 000–210 000 faults and 2 s of system time, with these
 * settings 34 000 and 0.8 s (10^7 rounds: median 0.78 s → 0.63 s). Peak memory does not change;
 * the process keeps its high-water mark between analyses. See DEVELOPERS.md, "Engine speed".
 *
 * glibc reads `GLIBC_TUNABLES` once, at process start, so it is set where engine processes are
 * started: the worker's spawn, the package scripts (`analyse`, `verify`, `worker`, and `api`,
 * whose uploads take the census), the benches. Other C libraries ignore it; `npm start` does not
 * set it, since its PostgreSQL would inherit it.
 */
export const ENGINE_MALLOC_TUNABLES = 'glibc.malloc.trim_threshold=1073741824:glibc.malloc.top_pad=67108864';

/** `environment` with the engine's allocator settings added to any tunables it already names. */
export function withEngineMemory(environment: NodeJS.ProcessEnv): NodeJS.ProcessEnv {
  const current = environment.GLIBC_TUNABLES;
  if (current?.includes('glibc.malloc.trim_threshold')) return environment;
  return { ...environment, GLIBC_TUNABLES: current ? `${current}:${ENGINE_MALLOC_TUNABLES}` : ENGINE_MALLOC_TUNABLES };
}
