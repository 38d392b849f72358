export * from './design-body';
export * from './derive-design';
export * from './design-drawing';
export * from './plan-design';
export * from './fabric-colour';
