export * from './auth';
export * from './offices';
export * from './soundings';
export * from './outlooks';
export * from './issuances';
export * from './subscriptions';
export * from './mail';
export * from './verification';
