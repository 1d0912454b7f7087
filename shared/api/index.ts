export * from './auth';
export * from './errors';
export * from './roles';
export * from './users';
