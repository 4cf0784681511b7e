/** Harvest options (METHODS.md §8): adjustments, response rules, option runs, uncertainty and harvest sensitivity. */
export * from './apply-option';
export * from './bottom-up';
export * from './difference';
export * from './harvest-sensitivity';
export * from './least-change-response';
export * from './option-web';
export * from './parse-option';
export * from './run-option';
export * from './uncertainty';
export * from './uncertainty-draw';
