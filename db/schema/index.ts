/**
 * The whole Drizzle schema. Each area keeps its tables in its own file here;
 * this index re-exports them for the client and for drizzle-kit.
 */
export {};
export * from './auth';
export * from './networks';
export * from './stations';
export * from './runs';
export * from './mail';
export * from './sharing';
export * from './comments';
export * from './audit';
