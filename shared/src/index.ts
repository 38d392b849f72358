// Public API of the domain maths package. Each concept lives in its own file.
export {};
export * from './workflow/index';
export * from './errors';
export * from './measure';
export * from './parse-length';
export * from './format-length';
export * from './rounding';
