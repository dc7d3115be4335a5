export * from './results.js';
export * from './csv.js';
