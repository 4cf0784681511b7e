export * from './web';
export * from './option';
export * from './issues';
export * from './analysis';
export * from './roles';
export * from './accounts';
export * from './webs-api';
