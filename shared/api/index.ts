export * from './roles';
export * from './errors';
export * from './session';
export * from './users';
export * from './projects';
export * from './health';
export * from './cautions';
