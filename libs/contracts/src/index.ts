export * from './web';
export * from './option';
export * from './issues';
export * from './analysis';
