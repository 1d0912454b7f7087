// The browser uses this folder's constants and types, never its zod schemas. So that its bundle
// leaves them out, and zod with them: every schema is declared /* @__PURE__ */ and ends in a call
// with literal arguments (most often .meta), and package.json here marks the folder free of side
// effects (without it, esbuild's code splitting keeps zod's chunk in the first load).
export * from './audit';
export * from './auth';
export * from './bookings';
export * from './errors';
export * from './integrity';
export * from './ledger';
export * from './planner';
export * from './profiles';
export * from './query-fields';
export * from './acquisition-date';
export * from './roles';
export * from './runs';
export * from './setups';
export * from './stations';
export * from './users';
export * from './workers';
