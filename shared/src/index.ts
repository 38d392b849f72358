// Public API of the domain maths package. Each concept lives in its own file.
export {};
export * from './workflow/index';
