export * from './display';
export * from './format';
export * from './parse';
export * from './quantities';
