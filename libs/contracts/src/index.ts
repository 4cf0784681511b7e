export * from './web';
export * from './option';
export * from './issues';
