import fc from 'fast-check';

/**
 * Property tests draw from a fixed seed, so CI runs the same cases every time and a failure can be
 * run again; `FC_SEED=<n> npx jest ...` explores other cases (fast-check prints the seed it used).
 */
fc.configureGlobal({ seed: Number(process.env['FC_SEED'] ?? 20261204) });
