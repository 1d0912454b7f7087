export * from './auth';
export * from './errors';
export * from './profiles';
export * from './roles';
export * from './runs';
export * from './setups';
export * from './users';
