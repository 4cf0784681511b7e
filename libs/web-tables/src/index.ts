export * from './layout';
export * from './limits';
export * from './engine-check';
export * from './tables-to-web';
export * from './read-upload';
export * from './web-rows';
export * from './write-csv';
export * from './write-xlsx';
